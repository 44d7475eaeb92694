// A moving target in one night. Its topocentric apparent direction is evaluated on a grid of
// `stepMinutes` (default 1) — ephemeris interpolation, the night's precession–nutation
// matrix, parallax when Δ is known, annual aberration — and crossings are placed by linear
// interpolation between neighbouring grid points. The grid is walked in strides: from each
// evaluated point, every margin (altitude, hour angle, declination, Sun) gets the time
// before it could change sign, from upper bounds on Earth rotation, the target's own motion
// and parallax; points inside that time are skipped. The windows are therefore those of the
// full 1-minute grid, at a fraction of the evaluations.

import { DEG, wrapPi } from "./angles";
import type { EffectiveLimits } from "./constraints";
import type { Ephemeris } from "./ephemeris";
import { clipIntervals, type Interval, sampledPositiveIntervals, totalDuration } from "./intervals";
import { lastAt, type NightContext } from "./night-context";
import { SIDEREAL_RATE } from "./sidereal-time";
import { KM_PER_AU, type SiteGeometry } from "./site";
import { makeWindow, type ObservableWindow, type TargetNight } from "./target-night";
import type { Instant } from "./time-scales";
import type { Vec3 } from "./vectors";

// Module-local copy: imported bindings can be getter calls, and this is hot.
const RATE = SIDEREAL_RATE;
/** The Sun's geocentric motion, ≈ 1°/day, with slack, radians per ms. */
const SUN_RATE = (1.2 * DEG) / 86_400_000;

export class MovingTargetSolver {
  // Grown on first use: every Planner makes a solver, but only moving targets sample.
  private sampleTimes = new Float64Array(0);
  private sampleBase = new Float64Array(0);
  private sampleAll = new Float64Array(0);
  private readonly posBuf = new Float64Array(4);
  private readonly margins = new Float64Array(12);

  constructor(
    private readonly geo: SiteGeometry,
    private readonly limits: EffectiveLimits,
    private readonly stepMs: number,
  ) {}

  solve(ctx: NightContext, ephemeris: Ephemeris, dark: Interval[], notes: string[]): TargetNight {
    const L = this.limits;
    const { frame, geo } = ctx;
    const covered = clipIntervals(dark, ephemeris.start, ephemeris.end);
    if (totalDuration(covered) < totalDuration(dark)) {
      notes.push(
        "The ephemeris does not cover all of this night's dark hours; times outside it are treated as not observable.",
      );
    }
    const M = frame.matrix;
    const beta = frame.aberration;
    const withParallax = ephemeris.hasDistance;
    const rc = geo.axisDistanceKm / KM_PER_AU;
    const rs = geo.equatorDistanceKm / KM_PER_AU;
    const p = this.posBuf;

    // Topocentric apparent direction into `out`; false outside the table.
    const out: Vec3 = [0, 0, 0];
    const directionAt = (t: Instant, cosL: number, sinL: number): boolean => {
      if (!ephemeris.positionInto(t, p)) return false;
      let x = M[0] * p[0]! + M[1] * p[1]! + M[2] * p[2]!;
      let y = M[3] * p[0]! + M[4] * p[1]! + M[5] * p[2]!;
      let z = M[6] * p[0]! + M[7] * p[1]! + M[8] * p[2]!;
      if (withParallax) {
        x -= rc * cosL;
        y -= rc * sinL;
        z -= rs;
      }
      let n = Math.sqrt(x * x + y * y + z * z);
      x = x / n + beta[0];
      y = y / n + beta[1];
      z = z / n + beta[2];
      n = Math.sqrt(x * x + y * y + z * z);
      out[0] = x / n;
      out[1] = y / n;
      out[2] = z / n;
      return true;
    };
    const direction = (t: Instant): Vec3 | null => {
      const last = lastAt(ctx, t);
      return directionAt(t, Math.cos(last), Math.sin(last)) ? [out[0], out[1], out[2]] : null;
    };
    const sinAltAt = (t: Instant): number | null => {
      const last = lastAt(ctx, t);
      const c = Math.cos(last);
      const s = Math.sin(last);
      return directionAt(t, c, s) ? geo.cosLat * (c * out[0] + s * out[1]) + geo.sinLat * out[2] : null;
    };

    // Bounds on how fast each margin can change, so the 1-minute grid can be walked in
    // strides where no margin can change sign: identical edges to evaluating every minute.
    const motion = this.motionBounds(ctx, ephemeris);
    const earth = RATE * (1 + motion.parallax);
    const rateAlt = earth + motion.rate; // |d sin h/dt| ≤ |dh/dt|
    const rateDec = motion.rate + RATE * motion.parallax;
    const rateHa = RATE + rateDec / Math.max(motion.minCosDec, 0.02);
    const rateSun = rateDec + SUN_RATE;

    // The Sun moves < 0.5° in a night: a linear track is plenty for sun avoidance.
    const sun0 = new Float64Array(4);
    const sun1 = new Float64Array(4);
    ctx.tracks.sunAt(ctx.mid, sun0);
    ctx.tracks.sunAt(ctx.mid + 3_600_000, sun1);
    const sunRate = [
      (sun1[0]! - sun0[0]!) / 3_600_000,
      (sun1[1]! - sun0[1]!) / 3_600_000,
      (sun1[2]! - sun0[2]!) / 3_600_000,
    ];

    const candidate: Interval[] = [];
    const afterSun: Interval[] = [];
    const evaluated: { t: number; sinAlt: number }[] = [];
    for (const iv of covered) {
      const n = Math.max(1, Math.ceil((iv.end - iv.start) / this.stepMs));
      const h = (iv.end - iv.start) / n;
      if (this.sampleTimes.length < n + 1) {
        this.sampleTimes = new Float64Array(n + 1);
        this.sampleBase = new Float64Array(n + 1);
        this.sampleAll = new Float64Array(n + 1);
      }
      const times = this.sampleTimes;
      const base = this.sampleBase;
      const all = this.sampleAll;
      let count = 0;
      for (let i = 0; i <= n;) {
        const t = i === n ? iv.end : iv.start + i * h;
        const last = lastAt(ctx, t);
        const c = Math.cos(last);
        const s = Math.sin(last);
        let stride = 1;
        if (directionAt(t, c, s)) {
          const sinAlt = geo.cosLat * (c * out[0] + s * out[1]) + geo.sinLat * out[2];
          // Every margin with its largest rate of change; the walk below turns them into
          // the time over which the sign of each series is certain.
          const mg = this.margins;
          let k = 0;
          mg[k++] = sinAlt - L.sinMinAltitude;
          mg[k++] = rateAlt;
          if (L.sinMaxAltitude !== null) {
            mg[k++] = L.sinMaxAltitude - sinAlt;
            mg[k++] = rateAlt;
          }
          if (L.hourAngle) {
            const ha = wrapPi(last - Math.atan2(out[1], out[0]));
            mg[k++] = ha - L.hourAngle.min;
            mg[k++] = rateHa;
            mg[k++] = L.hourAngle.max - ha;
            mg[k++] = rateHa;
          }
          if (L.declination) {
            const d = Math.asin(out[2]);
            mg[k++] = d - L.declination.min * DEG;
            mg[k++] = rateDec;
            mg[k++] = L.declination.max * DEG - d;
            mg[k++] = rateDec;
          }
          const dt = t - ctx.mid;
          const sx = sun0[0]! + sunRate[0]! * dt;
          const sy = sun0[1]! + sunRate[1]! * dt;
          const sz = sun0[2]! + sunRate[2]! * dt;
          const sunM =
            L.cosSunAvoidance - (out[0] * sx + out[1] * sy + out[2] * sz) / Math.sqrt(sx * sx + sy * sy + sz * sz);
          // min of the margins: positive → certain while every margin stays positive;
          // negative → certain while any one negative margin stays negative.
          let m = Infinity;
          let allPositiveFor = Infinity;
          let someNegativeFor = 0;
          for (let j = 0; j < k; j += 2) {
            const margin = mg[j]!;
            const time = Math.abs(margin) / mg[j + 1]!;
            if (margin < m) m = margin;
            if (margin < 0) someNegativeFor = Math.max(someNegativeFor, time);
            else allPositiveFor = Math.min(allPositiveFor, time);
          }
          const baseSure = m < 0 ? someNegativeFor : allPositiveFor;
          const sunTime = Math.abs(sunM) / rateSun;
          const allSure =
            sunM < 0
              ? Math.max(sunTime, m < 0 ? someNegativeFor : 0)
              : m < 0
                ? someNegativeFor
                : Math.min(allPositiveFor, sunTime);
          stride = Math.max(1, Math.floor((0.8 * Math.min(baseSure, allSure)) / h));
          times[count] = t;
          base[count] = m;
          all[count] = Math.min(m, sunM);
          count++;
          evaluated.push({ t, sinAlt });
        }
        if (i === n) break;
        i = Math.min(i + stride, n);
      }
      candidate.push(...sampledPositiveIntervals(times, base, count));
      afterSun.push(...sampledPositiveIntervals(times, all, count));
    }

    const best = (w: Interval): ObservableWindow => {
      // Best evaluated point in the window, then a golden-section polish between its neighbours.
      let bestT = w.start;
      let bestS = sinAltAt(w.start) ?? -2;
      const endS = sinAltAt(w.end) ?? -2;
      if (endS > bestS) {
        bestT = w.end;
        bestS = endS;
      }
      let lo = w.start;
      let hi = w.end;
      for (let i = 0; i < evaluated.length; i++) {
        const e = evaluated[i]!;
        if (e.t > w.start && e.t < w.end && e.sinAlt > bestS) {
          bestS = e.sinAlt;
          bestT = e.t;
          lo = Math.max(w.start, evaluated[i - 1]?.t ?? w.start);
          hi = Math.min(w.end, evaluated[i + 1]?.t ?? w.end);
        }
      }
      // Golden-section search, one new evaluation per step, to ten seconds: the altitude
      // is flat at its maximum, so that is far below an arcsecond.
      const g = (Math.sqrt(5) - 1) / 2;
      let a = lo;
      let b = hi;
      let x1 = b - g * (b - a);
      let x2 = a + g * (b - a);
      let f1 = sinAltAt(x1) ?? -2;
      let f2 = sinAltAt(x2) ?? -2;
      while (b - a > 10_000) {
        if (f1 >= f2) {
          b = x2;
          x2 = x1;
          f2 = f1;
          x1 = b - g * (b - a);
          f1 = sinAltAt(x1) ?? -2;
        } else {
          a = x1;
          x1 = x2;
          f1 = f2;
          x2 = a + g * (b - a);
          f2 = sinAltAt(x2) ?? -2;
        }
      }
      const polished = (a + b) / 2;
      const sp = sinAltAt(polished) ?? -2;
      if (sp > bestS) {
        bestS = sp;
        bestT = polished;
      }
      return makeWindow(w, Math.asin(Math.max(-1, Math.min(1, bestS))) / DEG, bestT);
    };
    return { candidate, afterSun, direction, best };
  }

  /** Upper bounds for the night, with slack: the target's angular rate (rad/ms), its
   * parallax (rad) and the smallest cos δ. */
  private motionBounds(ctx: NightContext, ephemeris: Ephemeris): { rate: number; parallax: number; minCosDec: number } {
    const m = ephemeris.motionBounds(ctx.span.start, ctx.span.end);
    const earthRadiusKm = Math.hypot(this.geo.axisDistanceKm, this.geo.equatorDistanceKm);
    const parallax = Number.isFinite(m.minDeltaAu) ? (1.5 * earthRadiusKm) / (m.minDeltaAu * KM_PER_AU) : 0;
    // Topocentric δ can differ from the rows' geocentric δ by up to the parallax.
    return { rate: 1.5 * m.rate + 1e-12, parallax, minCosDec: Math.max(0, m.minCosDec - 0.01 - parallax) };
  }
}

/** Topocentric apparent direction at one instant (allocates; for the occasional call). */
export function movingDirection(ctx: NightContext, ephemeris: Ephemeris, t: Instant): Vec3 | null {
  const sample = ephemeris.at(t);
  if (!sample) return null;
  const last = lastAt(ctx, t);
  const M = ctx.frame.matrix;
  const v = sample.position ?? sample.direction;
  let x = M[0] * v[0] + M[1] * v[1] + M[2] * v[2];
  let y = M[3] * v[0] + M[4] * v[1] + M[5] * v[2];
  let z = M[6] * v[0] + M[7] * v[1] + M[8] * v[2];
  if (sample.position) {
    x -= (ctx.geo.axisDistanceKm / KM_PER_AU) * Math.cos(last);
    y -= (ctx.geo.axisDistanceKm / KM_PER_AU) * Math.sin(last);
    z -= ctx.geo.equatorDistanceKm / KM_PER_AU;
  }
  const n = Math.hypot(x, y, z);
  const b = ctx.frame.aberration;
  const w: Vec3 = [x / n + b[0], y / n + b[1], z / n + b[2]];
  const m = Math.hypot(w[0], w[1], w[2]);
  return [w[0] / m, w[1] / m, w[2] / m];
}
