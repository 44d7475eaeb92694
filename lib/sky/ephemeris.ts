// Moving targets from an ephemeris table: rows of UTC time, geocentric astrometric RA/Dec
// (ICRS/J2000), and optionally r and Δ (au) and a magnitude.
//
// Interpolation: 4-point Lagrange (cubic) in time, in Newton form, of the geocentric
// Cartesian position Δ·u (or of the unit vector u, renormalised, when Δ is absent) —
// vectors have no 0h/24h seam, so RA wrap needs no special case and poles are harmless.
// At the table ends the four nearest rows are used (three or two when the table is that
// short); nothing is extrapolated beyond the first or last row.
// r uses the same cubic; magnitudes are interpolated linearly.

import { DEG } from "./angles";
import type { Instant } from "./time-scales";
import { toSpherical, unitVector, type Vec3 } from "./vectors";

export interface EphemerisRow {
  time: Instant;
  raDeg: number;
  decDeg: number;
  /** Heliocentric distance r, au. */
  rAu?: number;
  /** Geocentric distance Δ, au. */
  deltaAu?: number;
  magnitude?: number;
}

export interface EphemerisSample {
  /** Geocentric astrometric position: unit vector, and Δ·u in au when Δ is known. */
  direction: Vec3;
  position: Vec3 | null;
  raDeg: number;
  decDeg: number;
  deltaAu: number | null;
  rAu: number | null;
  magnitude: number | null;
}

interface Segment {
  // Newton form through up to four nodes x0..x3 (days from the segment start).
  x0: number;
  x1: number;
  x2: number;
  coef: Float64Array; // [a0, a1, a2, a3] for each of x, y, z, r
}

export class Ephemeris {
  readonly rows: readonly EphemerisRow[];
  readonly start: Instant;
  readonly end: Instant;
  readonly hasDistance: boolean;
  readonly hasHeliocentricDistance: boolean;
  private readonly values: Float64Array; // per row: x, y, z, r
  private readonly segments: (Segment | undefined)[];
  private cursor = 0;

  constructor(rows: readonly EphemerisRow[]) {
    if (rows.length < 2) throw new RangeError("an ephemeris needs at least two rows");
    for (let i = 1; i < rows.length; i++) {
      if (!(rows[i]!.time > rows[i - 1]!.time)) {
        throw new RangeError(`ephemeris rows must be in strictly increasing time order (row ${i + 1})`);
      }
    }
    this.rows = rows;
    this.start = rows[0]!.time;
    this.end = rows[rows.length - 1]!.time;
    this.hasDistance = rows.every((r) => r.deltaAu !== undefined);
    this.hasHeliocentricDistance = rows.every((r) => r.rAu !== undefined);
    this.values = new Float64Array(rows.length * 4);
    rows.forEach((r, i) => {
      const u = unitVector(r.raDeg * DEG, r.decDeg * DEG);
      const k = this.hasDistance ? r.deltaAu! : 1;
      this.values[i * 4] = u[0] * k;
      this.values[i * 4 + 1] = u[1] * k;
      this.values[i * 4 + 2] = u[2] * k;
      this.values[i * 4 + 3] = r.rAu ?? 0;
    });
    this.segments = new Array<Segment | undefined>(rows.length - 1);
  }

  covers(t: Instant): boolean {
    return t >= this.start && t <= this.end;
  }

  private segmentIndex(t: Instant): number {
    const rows = this.rows;
    let i = Math.min(Math.max(this.cursor, 0), rows.length - 2);
    // Calls mostly walk forward in time: start from the last segment used.
    if (t < rows[i]!.time) {
      let lo = 0;
      let hi = i;
      while (hi - lo > 1) {
        const m = (lo + hi) >> 1;
        if (rows[m]!.time <= t) lo = m;
        else hi = m;
      }
      i = lo;
    } else {
      while (i < rows.length - 2 && rows[i + 1]!.time <= t) i++;
    }
    this.cursor = i;
    return i;
  }

  private segment(i: number): Segment {
    const cached = this.segments[i];
    if (cached) return cached;
    const n = this.rows.length;
    const first = Math.max(0, Math.min(i - 1, n - 4));
    const count = Math.min(4, n);
    const idx = Array.from({ length: count }, (_, k) => first + k);
    const t0 = this.rows[i]!.time;
    const xs = idx.map((j) => (this.rows[j]!.time - t0) / 86_400_000);
    const coef = new Float64Array(16);
    for (let d = 0; d < 4; d++) {
      // Divided differences.
      const f = idx.map((j) => this.values[j * 4 + d]!);
      for (let level = 1; level < count; level++) {
        for (let k = count - 1; k >= level; k--) f[k] = (f[k]! - f[k - 1]!) / (xs[k]! - xs[k - level]!);
      }
      for (let k = 0; k < 4; k++) coef[d * 4 + k] = f[k] ?? 0;
    }
    const seg: Segment = { x0: xs[0]!, x1: xs[1] ?? 0, x2: xs[2] ?? 0, coef };
    this.segments[i] = seg;
    return seg;
  }

  /** Interpolated geocentric position (au, ICRS) into out[0..2]; out[3] = r (au). Returns
   * false outside the table. Fast path for scans: no allocation. */
  positionInto(t: Instant, out: Float64Array): boolean {
    if (!this.covers(t)) return false;
    const i = this.segmentIndex(t);
    const s = this.segment(i);
    const x = (t - this.rows[i]!.time) / 86_400_000;
    const c = s.coef;
    const dx0 = x - s.x0;
    const dx1 = x - s.x1;
    const dx2 = x - s.x2;
    for (let d = 0; d < 4; d++) {
      const o = d * 4;
      out[d] = c[o]! + dx0 * (c[o + 1]! + dx1 * (c[o + 2]! + dx2 * c[o + 3]!));
    }
    return true;
  }

  private readonly scratch = new Float64Array(4);
  private pairRates: Float64Array | null = null;

  /** Bounds on the motion between t0 and t1, from the rows themselves: the largest
   * row-to-row angular rate (rad/ms), the smallest Δ (au, Infinity without Δ) and the
   * smallest cos δ. The cubic between rows follows them closely, so callers add slack. */
  motionBounds(t0: Instant, t1: Instant): { rate: number; minDeltaAu: number; minCosDec: number } {
    const n = this.rows.length;
    if (!this.pairRates) {
      const rates = new Float64Array(n - 1);
      for (let i = 0; i < n - 1; i++) {
        const a = this.unit(i);
        const b = this.unit(i + 1);
        const cos = Math.min(1, a[0] * b[0] + a[1] * b[1] + a[2] * b[2]);
        rates[i] = Math.acos(cos) / (this.rows[i + 1]!.time - this.rows[i]!.time);
      }
      this.pairRates = rates;
    }
    let lo = Math.max(0, this.segmentIndex(Math.max(t0, this.start)) - 1);
    const hi = Math.min(n - 1, this.segmentIndex(Math.min(t1, this.end)) + 2);
    let rate = 0;
    let minDeltaAu = Infinity;
    let minCosDec = 1;
    for (; lo <= hi; lo++) {
      if (lo < n - 1) rate = Math.max(rate, this.pairRates[lo]!);
      const u = this.unit(lo);
      minCosDec = Math.min(minCosDec, Math.sqrt(Math.max(0, 1 - u[2] * u[2])));
      if (this.hasDistance) minDeltaAu = Math.min(minDeltaAu, this.rows[lo]!.deltaAu!);
    }
    return { rate, minDeltaAu, minCosDec };
  }

  private units: Float64Array | null = null;

  private unit(i: number): Vec3 {
    if (!this.units) {
      const u = new Float64Array(this.rows.length * 3);
      for (let j = 0; j < this.rows.length; j++) {
        const x = this.values[j * 4]!;
        const y = this.values[j * 4 + 1]!;
        const z = this.values[j * 4 + 2]!;
        const d = Math.hypot(x, y, z);
        u[j * 3] = x / d;
        u[j * 3 + 1] = y / d;
        u[j * 3 + 2] = z / d;
      }
      this.units = u;
    }
    return [this.units[i * 3]!, this.units[i * 3 + 1]!, this.units[i * 3 + 2]!];
  }

  /** Interpolated sample, or null outside the table. */
  at(t: Instant): EphemerisSample | null {
    if (!this.positionInto(t, this.scratch)) return null;
    const v: Vec3 = [this.scratch[0]!, this.scratch[1]!, this.scratch[2]!];
    const len = Math.hypot(v[0], v[1], v[2]);
    const direction: Vec3 = [v[0] / len, v[1] / len, v[2] / len];
    const { lon, lat } = toSpherical(direction);
    return {
      direction,
      position: this.hasDistance ? v : null,
      raDeg: lon / DEG,
      decDeg: lat / DEG,
      deltaAu: this.hasDistance ? len : null,
      rAu: this.hasHeliocentricDistance ? this.scratch[3]! : null,
      magnitude: this.magnitudeAt(t),
    };
  }

  /** Row magnitudes interpolated linearly, or null where the bracketing rows have none. */
  magnitudeAt(t: Instant): number | null {
    if (!this.covers(t)) return null;
    const i = this.segmentIndex(t);
    const a = this.rows[i]!;
    const b = this.rows[i + 1]!;
    if (a.magnitude === undefined || b.magnitude === undefined) return null;
    const f = (t - a.time) / (b.time - a.time);
    return a.magnitude + f * (b.magnitude - a.magnitude);
  }
}
