// Exact reference levels: Bessel J_nu of real order and its zeros against DLMF / Abramowitz & Stegun values, the disk with a
// centred tube (E = j_{|m - alpha|, n}^2 / R^2) and the rectangle (E = pi^2 (n^2/a^2 + m^2/b^2)).
import { describe, expect, it } from 'vitest';
import { besselJ, besselJZeros, diskLevelEnergy, diskLevels, exactCaseFor, logGamma, rectangleLevels } from '@/lib/charts/exact-levels';

const close = (a: number, b: number, rel = 1e-12) => expect(Math.abs(a - b) / Math.max(1, Math.abs(b))).toBeLessThan(rel);

/** Roots of tan x = x (zeros of J_{3/2}) by bisection on sin x - x cos x, independent of the code under test. */
function tanRoot(lo: number, hi: number): number {
  const f = (x: number) => Math.sin(x) - x * Math.cos(x);
  for (let i = 0; i < 200; i++) {
    const mid = (lo + hi) / 2;
    if (Math.sign(f(mid)) === Math.sign(f(lo))) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

describe('Bessel zeros', () => {
  it('integer orders match DLMF §10.21 / A&S Table 9.5', () => {
    const [j01, j02] = besselJZeros(0, 2);
    close(j01, 2.404825557695773); // DLMF §10.21, A&S Table 9.5
    close(j02, 5.520078110286311); // DLMF §10.21, A&S Table 9.5
    close(besselJZeros(1, 1)[0], 3.831705970207512); // DLMF §10.21, A&S Table 9.5
    close(besselJZeros(2, 1)[0], 5.135622301840683); // DLMF §10.21, A&S Table 9.5
  });

  it('half orders: j_{1/2,n} = n pi and the zeros of J_{3/2} solve tan x = x (DLMF 10.16.1)', () => {
    besselJZeros(0.5, 6).forEach((z, i) => close(z, (i + 1) * Math.PI));
    const [a, b] = besselJZeros(1.5, 2);
    close(a, 4.493409457909064); // DLMF 10.16.1 (tan x = x)
    close(b, 7.725251836937707); // DLMF 10.16.1 (tan x = x)
    close(a, tanRoot(4, 4.7));
    close(b, tanRoot(7, 7.8));
  });

  it('J_{1/2} and J_{3/2} equal their elementary forms over a wide range (DLMF 10.16.1)', () => {
    for (const x of [0.01, 0.5, 3, 7.9, 8.1, 12, 20, 35, 60]) {
      const s = Math.sqrt(2 / (Math.PI * x));
      expect(Math.abs(besselJ(0.5, x) - s * Math.sin(x))).toBeLessThan(1e-13);
      expect(Math.abs(besselJ(1.5, x) - s * (Math.sin(x) / x - Math.cos(x)))).toBeLessThan(1e-13);
    }
  });

  it('edge cases and bad input', () => {
    expect(besselJ(0, 0)).toBe(1);
    expect(besselJ(0.3, 0)).toBe(0);
    expect(() => besselJ(-1, 1)).toThrow(RangeError);
    expect(() => besselJ(1, Number.NaN)).toThrow(/argument x/);
    expect(() => besselJZeros(0, 1.5)).toThrow(/count/);
    close(logGamma(5), Math.log(24));
    close(logGamma(0.5), 0.5 * Math.log(Math.PI)); // Γ(1/2) = sqrt(pi), DLMF 5.4.6
  });

  it('zeros of a generic order interlace with the neighbouring orders (DLMF 10.21.2)', () => {
    const nu = 0.3;
    const lower = besselJZeros(nu, 4);
    const upper = besselJZeros(nu + 1, 4);
    expect(lower).toHaveLength(4);
    expect(upper).toHaveLength(4);
    for (let k = 0; k < 4; k++) {
      expect(lower[k]).toBeLessThan(upper[k]);
      expect(Math.abs(besselJ(nu, lower[k]))).toBeLessThan(1e-13);
    }
    for (let k = 0; k < 3; k++) expect(upper[k]).toBeLessThan(lower[k + 1]);
  });
});

describe('disk and rectangle levels', () => {
  it('unit disk without flux: j01², j11² twice, j21² twice, j02² (PHYSICS.md §6, DLMF §10.21)', () => {
    const e = diskLevels(0, 1, 6).map((l) => l.energy);
    [5.783186, 14.681971, 14.681971, 26.374616, 26.374616, 30.471262].forEach((v, i) => expect(e[i]).toBeCloseTo(v, 5));
  });

  it('centred half tube: pi² twice then 4.493409457909064² twice (DLMF 10.16.1)', () => {
    const e = diskLevels(0.5, 1, 4).map((l) => l.energy);
    close(e[0], Math.PI ** 2);
    close(e[1], Math.PI ** 2);
    close(e[2], 4.493409457909064 ** 2, 1e-12);
    close(e[3], 4.493409457909064 ** 2, 1e-12);
  });

  it('periodic in alpha and symmetric under alpha -> 1 - alpha (Byers & Yang 1961); scales as 1/R²', () => {
    const a = diskLevels(0.3, 1, 8).map((l) => l.energy);
    const b = diskLevels(1.3, 1, 8).map((l) => l.energy);
    const c = diskLevels(0.7, 1, 8).map((l) => l.energy);
    const d = diskLevels(0.3, 2, 8).map((l) => l.energy);
    a.forEach((v, i) => {
      close(b[i], v);
      close(c[i], v);
      close(d[i], v / 4);
    });
    close(diskLevelEnergy(0, 1, 0.3, 1), a[0]);
  });

  it('rectangle a x b: pi² (n²/a² + m²/b²)', () => {
    const e = rectangleLevels(1, 2, 4).map((l) => l.energy / Math.PI ** 2);
    [1.25, 2, 3.25, 4.25].forEach((v, i) => close(e[i], v));
    expect(() => rectangleLevels(0, 1, 1)).toThrow(RangeError);
  });

  it('exactCaseFor: centred tubes add up; off-centre fractional flux has no closed form; tubes outside do not matter', () => {
    const disk = { disk: { center: [0.5, 0] as [number, number], radius: 1 } };
    expect(exactCaseFor({ well: disk, tubes: [{ at: [0.5, 0], alpha: 0.25 }, { at: [0.5, 0], alpha: 0.25 }] })).toEqual({ kind: 'disk', radius: 1, centre: [0.5, 0], alpha: 0.5 });
    expect(exactCaseFor({ well: disk, tubes: [{ at: [0.7, 0], alpha: 0.5 }] })).toBeNull();
    expect(exactCaseFor({ well: disk, tubes: [{ at: [0.7, 0], alpha: 2 }] })).toMatchObject({ kind: 'disk', alpha: 0 });
    expect(exactCaseFor({ well: disk, tubes: [{ at: [3, 0], alpha: 0.3 }] })).toMatchObject({ kind: 'disk', alpha: 0 });
    expect(exactCaseFor({ well: disk, potential: 'x^2' })).toBeNull();
    expect(exactCaseFor({ well: { rectangle: { min: [0, 0], max: [2, 1] } } })).toEqual({ kind: 'rectangle', a: 2, b: 1 });
    expect(exactCaseFor({ well: { rectangle: { min: [0, 0], max: [2, 1] } }, tubes: [{ at: [1, 0.5], alpha: 0.5 }] })).toBeNull();
    expect(exactCaseFor({ well: { polygon: { points: [[0, 0], [1, 0], [0, 1]] } } })).toBeNull();
  });
});
