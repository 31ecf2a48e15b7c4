// Loop phases of a tube carried around loops in and around the unit disk (PHYSICS.md section 3): half tube signs
// (Longuet-Higgins 1975; Berry 1984), the phase -2 pi alpha of a charge enclosed by a counter-clockwise loop at a generic
// flux (Berry 1984), its conjugate clockwise, and |W| = 1 for loops that stay outside the well.
import { describe, expect, it } from 'vitest';
import { AbortError, SpecError } from '@/lib/physics/errors';
import { parseTaskSpec } from '@/lib/physics/schemas';
import type { HolonomySpec } from '@/lib/physics/schemas/holonomy';
import { runHolonomy } from '@/lib/physics/tasks/holonomy';

const disk = { disk: { center: [0, 0], radius: 1 } };

function spec(extra: Record<string, unknown>): HolonomySpec {
  return parseTaskSpec({ task: 'holonomy', well: disk, grid: { h: 1 / 16 }, moving: { alpha: 0.5 }, ...extra }) as HolonomySpec;
}

/** Reduce to (-pi, pi]. */
function reduce(phase: number): number {
  let p = phase % (2 * Math.PI);
  if (p <= -Math.PI) p += 2 * Math.PI;
  if (p > Math.PI) p -= 2 * Math.PI;
  return p;
}

describe('holonomy of the unit disk with a moving half tube (Longuet-Higgins 1975; Berry 1984)', () => {
  it('gives -1 for a loop enclosing the whole disk', async () => {
    const r = await runHolonomy(spec({ loop: { circle: { center: [0, 0], radius: 1.3 } } }));
    expect(r.sign).toBe(-1);
    expect(r.phase).toBe(Math.PI);
    expect(r.residual!).toBeLessThan(1e-9);
    expect(Math.abs(r.modulus - 1)).toBeLessThan(1e-9);
    expect(r.orientation).toBe('ccw');
    expect(r.steps).toBe(r.path.length);
  });

  it('gives +1 with |W| ~ 1 for a far loop away from the disk', async () => {
    const r = await runHolonomy(spec({ loop: { circle: { center: [2.5, 0.5], radius: 0.6 } } }));
    expect(r.sign).toBe(1);
    expect(r.phase).toBe(0);
    expect(Math.abs(r.modulus - 1)).toBeLessThan(1e-9);
  });

  it('gives -1 for inside loops exactly when they enclose the centre', async () => {
    const around = await runHolonomy(spec({ loop: { circle: { center: [0.1, -0.05], radius: 0.4 } } }));
    expect(around.sign).toBe(-1);
    const beside = await runHolonomy(spec({ loop: { circle: { center: [0.45, 0.1], radius: 0.3 } } }));
    expect(beside.sign).toBe(1);
    const polygon = await runHolonomy(spec({ loop: { polygon: [[-0.6, -0.2], [0.3, -0.5], [0.5, 0.4], [-0.3, 0.5]] } }));
    expect(polygon.sign).toBe(-1);
    expect(polygon.residual!).toBeLessThan(1e-9);
  });
});

describe('holonomy at a generic flux (Berry 1984: phase of a charge carried around a flux line)', () => {
  it('counter-clockwise loop enclosing the disk: phase -2 pi alpha, modulus 1; clockwise: the conjugate', async () => {
    const alpha = 0.3;
    const ccw = await runHolonomy(spec({ moving: { alpha }, loop: { circle: { center: [0, 0], radius: 1.25 } } }));
    expect(ccw.sign).toBeUndefined();
    expect(ccw.phase).toBeCloseTo(reduce(-2 * Math.PI * alpha), 8);
    expect(Math.abs(ccw.modulus - 1)).toBeLessThan(1e-9);
    const cw = await runHolonomy(spec({ moving: { alpha }, orientation: 'cw', loop: { circle: { center: [0, 0], radius: 1.25 } } }));
    expect(cw.orientation).toBe('cw');
    expect(cw.phase).toBeCloseTo(-ccw.phase, 8);
    expect(cw.holonomy.im).toBeCloseTo(-ccw.holonomy.im, 8);
  });

  it('a loop outside the well gives 1 with |W| = 1 to ~1e-12', async () => {
    const r = await runHolonomy(spec({ moving: { alpha: 0.3 }, loop: { polygon: [[1.4, -0.5], [2.2, -0.5], [2.2, 0.6], [1.4, 0.6]] } }));
    expect(Math.abs(r.holonomy.re - 1)).toBeLessThan(1e-10);
    expect(Math.abs(r.phase)).toBeLessThan(1e-10);
    expect(Math.abs(r.modulus - 1)).toBeLessThan(1e-10);
  });

  it('a fixed half tube inside the loop leaves the moving tube its own phase -2 pi alpha', async () => {
    const r = await runHolonomy(
      spec({ moving: { alpha: 0.3 }, tubes: [{ at: [0.2, 0.1], alpha: 0.5 }], loop: { circle: { center: [0, 0], radius: 1.25 } } }),
    );
    // The fixed tube is part of H at every step (the same for all k), so only the moving tube's flux enters W.
    expect(r.phase).toBeCloseTo(reduce(-2 * Math.PI * 0.3), 8);
  });

  it('refuses a loop that encloses no grid site', async () => {
    await expect(runHolonomy(spec({ loop: { circle: { center: [0, 0], radius: 0.02 } } }))).rejects.toBeInstanceOf(SpecError);
  });

  it('reports progress up to 1 and cancels with AbortError', async () => {
    const fractions: number[] = [];
    await runHolonomy(spec({ loop: { circle: { center: [2.5, 0.5], radius: 0.3 } } }), { onProgress: (f) => fractions.push(f) });
    expect(fractions[0]).toBe(0);
    expect(fractions[fractions.length - 1]).toBe(1);
    for (let i = 1; i < fractions.length; i++) expect(fractions[i]).toBeGreaterThanOrEqual(fractions[i - 1]);
    const controller = new AbortController();
    const pending = runHolonomy(spec({ loop: { circle: { center: [0, 0], radius: 1.3 } } }), {
      signal: controller.signal,
      onProgress: (f) => {
        if (f > 0.1) controller.abort();
      },
    });
    await expect(pending).rejects.toBeInstanceOf(AbortError);
  });
});
