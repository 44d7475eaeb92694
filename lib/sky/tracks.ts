// Interpolated tracks of slowly varying quantities. Nutation and the Sun are evaluated every
// second day, the Moon twice a day, and every instant in between is a 4-point (cubic)
// Lagrange interpolation over equally spaced nodes. Interpolation error: nutation and Sun
// < 0.01″ (their fastest terms have periods of 9–30 days), Moon ≈ 1″ (its ~13°/day motion
// is the largest fourth derivative here).
// Nodes depend only on the instant, so one SkyTracks can serve every computation in the
// process (sharedSkyTracks); each track keeps at most MAX_NODES nodes (years of them).

import { type Nutation, nutation } from "./nutation";
import { moonApparent, moonVectorKm } from "./moon";
import { sunApparent } from "./sun";
import { centuriesTT, type Instant, J2000_MS, MS_PER_DAY } from "./time-scales";
import { unitVector, type Vec3 } from "./vectors";

// Module-local copy of the epoch: this is read on every interpolation.
const EPOCH = J2000_MS;

const MAX_NODES = 4_000;

export class UniformTrack {
  private readonly cache = new Map<number, Float64Array>();

  constructor(
    private readonly spacingMs: number,
    private readonly dims: number,
    private readonly compute: (t: Instant, out: Float64Array) => void,
  ) {}

  private node(k: number): Float64Array {
    let v = this.cache.get(k);
    if (!v) {
      v = new Float64Array(this.dims);
      this.compute(EPOCH + k * this.spacingMs, v);
      if (this.cache.size >= MAX_NODES) this.cache.clear();
      this.cache.set(k, v);
    }
    return v;
  }

  /** Writes the interpolated value at t into out. */
  at(t: Instant, out: Float64Array): Float64Array {
    const x = (t - EPOCH) / this.spacingMs;
    const k = Math.floor(x);
    const p = x - k;
    const a = this.node(k - 1);
    const b = this.node(k);
    const c = this.node(k + 1);
    const d = this.node(k + 2);
    const wa = (-p * (p - 1) * (p - 2)) / 6;
    const wb = ((p + 1) * (p - 1) * (p - 2)) / 2;
    const wc = (-(p + 1) * p * (p - 2)) / 2;
    const wd = ((p + 1) * p * (p - 1)) / 6;
    for (let i = 0; i < this.dims; i++) out[i] = wa * a[i]! + wb * b[i]! + wc * c[i]! + wd * d[i]!;
    return out;
  }
}

export class SkyTracks {
  readonly nutation: UniformTrack;
  /** Apparent Sun: unit vector (true equator of date) and distance in au. */
  readonly sun: UniformTrack;
  /** Apparent geocentric Moon, km, true equator of date. */
  readonly moon: UniformTrack;
  private readonly scratch = new Float64Array(2);

  constructor() {
    this.nutation = new UniformTrack(2 * MS_PER_DAY, 2, (t, out) => {
      const n = nutation(centuriesTT(t));
      out[0] = n.deltaPsi;
      out[1] = n.deltaEpsilon;
    });
    this.sun = new UniformTrack(2 * MS_PER_DAY, 4, (t, out) => {
      const s = sunApparent(centuriesTT(t), this.nutationAt(t));
      const u = unitVector(s.ra, s.dec);
      out[0] = u[0];
      out[1] = u[1];
      out[2] = u[2];
      out[3] = s.distanceAu;
    });
    this.moon = new UniformTrack(MS_PER_DAY / 2, 3, (t, out) => {
      const v = moonVectorKm(moonApparent(centuriesTT(t), this.nutationAt(t)));
      out[0] = v[0];
      out[1] = v[1];
      out[2] = v[2];
    });
  }

  nutationAt(t: Instant): Nutation {
    this.nutation.at(t, this.scratch);
    return { deltaPsi: this.scratch[0]!, deltaEpsilon: this.scratch[1]! };
  }

  /** Apparent Sun as unit vector; the fourth slot of `out` receives the distance in au. */
  sunAt(t: Instant, out: Float64Array): Float64Array {
    this.sun.at(t, out);
    const n = Math.hypot(out[0]!, out[1]!, out[2]!);
    out[0] = out[0]! / n;
    out[1] = out[1]! / n;
    out[2] = out[2]! / n;
    return out;
  }

  moonAt(t: Instant, out: Float64Array): Float64Array {
    return this.moon.at(t, out);
  }
}

let shared: SkyTracks | null = null;

/** The process's SkyTracks: the Sun's and Moon's nodes are the same for every target and site. */
export function sharedSkyTracks(): SkyTracks {
  shared ??= new SkyTracks();
  return shared;
}

export function vec(a: Float64Array): Vec3 {
  return [a[0]!, a[1]!, a[2]!];
}
