// Reading and writing RA/Dec the ways astronomers type them.
//
//   RA:  "12:34:56.7"  "12 34 56.7"  "12h34m56.7s"  "12h 34.5m"  "12.5824h"
//        "188.7359" (a bare decimal is degrees unless told otherwise)  "188.7359°" / "188.7359d"
//        "188°44′09″" (sexagesimal degrees when the first mark is a degree mark)
//   Dec: "+12:34:56"  "-00 30 00"  "−0°30′00″"  "12d34m56s"  "-12.5"  "+45.123°"
//
// Sexagesimal without marks is hours for RA and degrees for Dec. The sign belongs to the
// whole value, so "-00 30 00" is −0.5°. Errors name what is wrong and where (1-based).

export type CoordinateKind = "right ascension" | "declination";

export class CoordinateParseError extends Error {
  readonly input: string;
  /** 1-based character position of the problem. */
  readonly position: number;
  readonly problem: string;

  constructor(kind: CoordinateKind, input: string, position: number, problem: string) {
    const name = kind === "right ascension" ? "Right ascension" : "Declination";
    const shown = input.length > 40 ? `${input.slice(0, 40)}…` : input;
    super(`${name} "${shown}": ${problem} (at character ${position}).`);
    this.name = "CoordinateParseError";
    this.input = input;
    this.position = position;
    this.problem = problem;
  }
}

type Unit = "h" | "d" | "m" | "s";
interface Field {
  text: string;
  value: number;
  start: number; // 0-based index into the input
  unit: Unit | null;
  unitAt: number;
}

const MINUS = new Set(["-", "\u2212", "\u2013"]);
const SPACE = /\s/;

function unitAt(input: string, i: number): { unit: Unit; length: number } | null {
  const rest = input.slice(i, i + 3).toLowerCase();
  if (rest.startsWith("deg")) return { unit: "d", length: 3 };
  const c = input[i]!;
  const next = input[i + 1];
  switch (c) {
    case "h":
    case "H":
    case "\u02b0":
      return { unit: "h", length: 1 };
    case "d":
    case "D":
    case "\u00b0":
    case "\u00ba":
      return { unit: "d", length: 1 };
    case "m":
    case "M":
    case "\u1d50":
    case "\u2032":
      return { unit: "m", length: 1 };
    case "'":
      // Two apostrophes are a seconds mark.
      return next === "'" ? { unit: "s", length: 2 } : { unit: "m", length: 1 };
    case "s":
    case "S":
    case "\u02e2":
    case "\u2033":
    case '"':
      return { unit: "s", length: 1 };
    default:
      return null;
  }
}

function readFields(kind: CoordinateKind, input: string): { negative: boolean; fields: Field[] } {
  const fail = (at: number, problem: string): never => {
    throw new CoordinateParseError(kind, input, at + 1, problem);
  };
  let i = 0;
  const n = input.length;
  while (i < n && SPACE.test(input[i]!)) i++;
  if (i === n) fail(0, "nothing to read");
  let negative = false;
  if (input[i] === "+" || MINUS.has(input[i]!)) {
    negative = input[i] !== "+";
    i++;
    while (i < n && SPACE.test(input[i]!)) i++;
  }
  const fields: Field[] = [];
  let needSeparator = false;
  while (i < n) {
    const c = input[i]!;
    if (SPACE.test(c)) {
      needSeparator = false;
      i++;
      continue;
    }
    if (c === ":") {
      if (fields.length === 0) fail(i, "a ':' before any number");
      const last = fields[fields.length - 1]!;
      if (last.unit !== null) fail(i, "a ':' right after a unit mark");
      let j = i + 1;
      while (j < n && SPACE.test(input[j]!)) j++;
      if (j === n || !/[0-9.]/.test(input[j]!)) fail(i, "a ':' with no number after it");
      needSeparator = false;
      i++;
      continue;
    }
    if (/[0-9.]/.test(c)) {
      if (needSeparator) fail(i, "two numbers run together; separate them with ':' or a space");
      if (fields.length === 3) fail(i, "more than three fields (expected degrees or hours, minutes, seconds)");
      const start = i;
      while (i < n && /[0-9]/.test(input[i]!)) i++;
      if (input[i] === ".") {
        i++;
        while (i < n && /[0-9]/.test(input[i]!)) i++;
      }
      const text = input.slice(start, i);
      if (text === "." || !/[0-9]/.test(text)) fail(start, "a '.' without digits");
      if (input[i] === ".") fail(i, "a second decimal point");
      if (input[i] === ",") fail(i, "a ',' — use '.' as the decimal mark");
      fields.push({ text, value: Number(text), start, unit: null, unitAt: -1 });
      // A unit mark may follow directly or after spaces.
      let j = i;
      while (j < n && SPACE.test(input[j]!)) j++;
      const u = j < n ? unitAt(input, j) : null;
      if (u) {
        const f = fields[fields.length - 1]!;
        f.unit = u.unit;
        f.unitAt = j;
        i = j + u.length;
        needSeparator = false;
      } else {
        needSeparator = true;
      }
      continue;
    }
    if (c === "+" || MINUS.has(c)) fail(i, "a sign is only allowed before the first number");
    if (c === ",") fail(i, "a ',' — use '.' as the decimal mark, and ':' or spaces between fields");
    if (unitAt(input, i)) fail(i, "a unit mark with no number before it");
    fail(i, `an unexpected character '${c}'`);
  }
  if (fields.length === 0) fail(i, "no number");
  return { negative, fields };
}

const ORDER: Record<"hours" | "degrees", readonly Unit[]> = {
  hours: ["h", "m", "s"],
  degrees: ["d", "m", "s"],
};
const NAMES = ["first", "minutes", "seconds"] as const;

function combine(kind: CoordinateKind, input: string, fields: Field[], scale: "hours" | "degrees"): number {
  const fail = (at: number, problem: string): never => {
    throw new CoordinateParseError(kind, input, at + 1, problem);
  };
  const order = ORDER[scale];
  let value = 0;
  fields.forEach((f, k) => {
    if (f.unit !== null && f.unit !== order[k]) {
      fail(f.unitAt, `the mark after the ${k === 0 ? "first field" : NAMES[k]} should be '${order[k]}'`);
    }
    if (k < fields.length - 1 && f.text.includes(".")) fail(f.start, "only the last field may have a fractional part");
    if (k > 0 && f.value >= 60) fail(f.start, `${NAMES[k]} must be less than 60`);
    value += f.value / 60 ** k;
  });
  return value;
}

export interface RaParseOptions {
  /** How to read a bare decimal with no unit mark. Default "degrees". */
  bareDecimal?: "degrees" | "hours";
}

/** Right ascension in degrees, [0, 360). */
export function parseRa(input: string, options: RaParseOptions = {}): number {
  const kind: CoordinateKind = "right ascension";
  if (typeof input !== "string") throw new CoordinateParseError(kind, String(input), 1, "not text");
  const { negative, fields } = readFields(kind, input);
  const first = fields[0]!;
  if (negative) throw new CoordinateParseError(kind, input, input.search(/[-\u2212\u2013]/) + 1, "cannot be negative");
  const marks = fields.map((f) => f.unit);
  let scale: "hours" | "degrees";
  if (marks[0] === "h") scale = "hours";
  else if (marks[0] === "d") scale = "degrees";
  else if (fields.length === 1) scale = options.bareDecimal ?? "degrees";
  else if (marks.includes("h")) scale = "hours";
  else if (marks.includes("d")) scale = "degrees";
  else scale = "hours";
  if (fields.length > 1 && marks[0] === "m") {
    throw new CoordinateParseError(kind, input, first.unitAt + 1, "the first field cannot be minutes");
  }
  const value = combine(kind, input, fields, scale);
  const degrees = scale === "hours" ? value * 15 : value;
  if (scale === "hours" && value >= 24) {
    throw new CoordinateParseError(kind, input, first.start + 1, "hours must be less than 24");
  }
  if (degrees >= 360) throw new CoordinateParseError(kind, input, first.start + 1, "must be less than 360°");
  return degrees;
}

/** Declination in degrees, [−90, +90]. */
export function parseDec(input: string): number {
  const kind: CoordinateKind = "declination";
  if (typeof input !== "string") throw new CoordinateParseError(kind, String(input), 1, "not text");
  const { negative, fields } = readFields(kind, input);
  const h = fields.find((f) => f.unit === "h");
  if (h) throw new CoordinateParseError(kind, input, h.unitAt + 1, "hours are not a unit of declination");
  const value = combine(kind, input, fields, "degrees");
  if (value > 90) throw new CoordinateParseError(kind, input, fields[0]!.start + 1, "must be between −90° and +90°");
  return negative ? -value : value;
}

/** Both at once, for a "RA, Dec" pair typed in two boxes. */
export function parseRaDec(ra: string, dec: string, options: RaParseOptions = {}): { raDeg: number; decDeg: number } {
  return { raDeg: parseRa(ra, options), decDeg: parseDec(dec) };
}

export interface FormatOptions {
  /** Digits after the decimal point of the seconds (default 2 for RA, 1 for Dec). */
  decimals?: number;
  /** "colons" 12:34:56.78 (default), "spaces" 12 34 56.78, "units" 12h34m56.78s / +12°34′56.8″. */
  style?: "colons" | "spaces" | "units";
}

function sexagesimal(value: number, decimals: number, wrap: number | null): [number, number, string] {
  const unit = 10 ** decimals;
  let ticks = Math.round(value * 3600 * unit);
  if (wrap !== null) ticks = ((ticks % (wrap * 3600 * unit)) + wrap * 3600 * unit) % (wrap * 3600 * unit);
  const whole = Math.floor(ticks / (3600 * unit));
  ticks -= whole * 3600 * unit;
  const minutes = Math.floor(ticks / (60 * unit));
  ticks -= minutes * 60 * unit;
  const secs = Math.floor(ticks / unit);
  const frac = ticks - secs * unit;
  const s = String(secs).padStart(2, "0") + (decimals > 0 ? "." + String(frac).padStart(decimals, "0") : "");
  return [whole, minutes, s];
}

/** Right ascension (degrees) as hours, minutes, seconds. */
export function formatRa(raDeg: number, options: FormatOptions = {}): string {
  if (!Number.isFinite(raDeg)) throw new RangeError(`right ascension must be a finite number, got ${raDeg}`);
  const decimals = options.decimals ?? 2;
  const [h, m, s] = sexagesimal(raDeg / 15, decimals, 24);
  const hh = String(h).padStart(2, "0");
  const mm = String(m).padStart(2, "0");
  switch (options.style ?? "colons") {
    case "spaces":
      return `${hh} ${mm} ${s}`;
    case "units":
      return `${hh}h${mm}m${s}s`;
    default:
      return `${hh}:${mm}:${s}`;
  }
}

/** Declination (degrees) as signed degrees, arcminutes, arcseconds. */
export function formatDec(decDeg: number, options: FormatOptions = {}): string {
  if (!Number.isFinite(decDeg) || Math.abs(decDeg) > 90) {
    throw new RangeError(`declination must be between -90 and +90 degrees, got ${decDeg}`);
  }
  const decimals = options.decimals ?? 1;
  const [d, m, s] = sexagesimal(Math.abs(decDeg), decimals, null);
  const zero = d === 0 && m === 0 && Number(s) === 0;
  const sign = decDeg < 0 && !zero ? "-" : "+";
  const dd = String(d).padStart(2, "0");
  const mm = String(m).padStart(2, "0");
  switch (options.style ?? "colons") {
    case "spaces":
      return `${sign}${dd} ${mm} ${s}`;
    case "units":
      return `${sign}${dd}°${mm}′${s}″`;
    default:
      return `${sign}${dd}:${mm}:${s}`;
  }
}
