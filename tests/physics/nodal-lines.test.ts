// Nodal lines of real states (PHYSICS.md sections 1 and 5): with a half tube every real state has a line ending at the
// tube; no false line runs along the branch cut; lines end on half tubes or the wall; complex problems are refused.
import { describe, expect, it } from 'vitest';
import { SpecError } from '@/lib/physics/errors';
import { parseTaskSpec } from '@/lib/physics/schemas';
import type { NodalLinesSpec } from '@/lib/physics/schemas/nodal-lines';
import { runNodalLines } from '@/lib/physics/tasks/nodal-lines';

const disk = { disk: { center: [0, 0], radius: 1 } };
const h = 1 / 20;

function spec(extra: Record<string, unknown>): NodalLinesSpec {
  return parseTaskSpec({ task: 'nodal-lines', well: disk, grid: { h }, ...extra }) as NodalLinesSpec;
}

function tubeEnds(lines: { ends: { kind: string; tube?: number }[] }[], tube: number): number {
  let n = 0;
  for (const l of lines) for (const e of l.ends) if (e.kind === 'tube' && e.tube === tube) n++;
  return n;
}

describe('nodal lines with a half tube (PHYSICS.md section 1)', () => {
  it('every real state of levels 0-3 has a line ending at the tube, and no line runs along the cut', async () => {
    const tube = { at: [0.2, 0.1], alpha: 0.5 };
    for (let level = 0; level < 4; level++) {
      const r = await runNodalLines(spec({ tubes: [tube], level }));
      const ends = tubeEnds(r.lines, 0);
      expect(ends % 2).toBe(1);
      // Lines end at the tube, on the wall, or close.
      for (const l of r.lines) {
        expect(l.points.length).toBeGreaterThanOrEqual(2);
        for (const e of l.ends) expect(['tube', 'wall', 'closed']).toContain(e.kind);
      }
      // Points lying on the cut (y = 0.1, x > 0.2 + h): a false cut line would put one on every link it crosses.
      const onCut = r.lines.flatMap((l) => l.points).filter(([x, y]) => x > 0.2 + h && Math.abs(y - 0.1) < 0.3 * h);
      expect(onCut.length).toBeLessThan(4);
    }
  });

  it('two half tubes: each has an odd number of line ends', async () => {
    const r = await runNodalLines(spec({ tubes: [{ at: [-0.3, -0.2], alpha: 0.5 }, { at: [0.35, 0.25], alpha: -0.5 }] }));
    expect(tubeEnds(r.lines, 0) % 2).toBe(1);
    expect(tubeEnds(r.lines, 1) % 2).toBe(1);
  });

  it('without flux the ground state has no line and the first excited state one wall-to-wall line', async () => {
    const ground = await runNodalLines(spec({ level: 0 }));
    expect(ground.lines).toHaveLength(0);
    expect(ground.sign.values.filter((v) => v < 0)).toHaveLength(0);
    const excited = await runNodalLines(spec({ level: 1, tubes: [{ at: [0.3, 0.3], alpha: 1 }] }));
    expect(excited.lines).toHaveLength(1);
    expect(excited.lines[0].ends).toEqual([{ kind: 'wall' }, { kind: 'wall' }]);
    // Level 1 of the disk is one of the degenerate m = +-1 pair (DLMF section 10.21: j11 twice).
    expect(excited.degenerate).toBe(true);
  });

  it('refuses a complex problem with a clear message', async () => {
    expect(() => spec({ tubes: [{ at: [0, 0], alpha: 0.3 }] })).toThrow(SpecError);
    expect(() => spec({ tubes: [{ at: [0, 0], alpha: 0.3 }] })).toThrow(/nodal lines need a real problem/);
    const raw = { ...spec({}), tubes: [{ at: [0, 0] as [number, number], alpha: 0.3 }] } as NodalLinesSpec;
    await expect(runNodalLines(raw)).rejects.toThrow(/real problem/);
  });
});
