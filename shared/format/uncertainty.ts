/**
 * The one number formatter: a value with its uncertainty, "0.962 ± 0.004".
 *
 * Digits follow the rounding rule of the Particle Data Group (Review of Particle Physics,
 * Introduction, section "Rounding"; rule quoted from memory): take the three highest digits of
 * the uncertainty; 100–354 → two significant digits, 355–949 → one, 950–999 → round up to 1000
 * and keep two. The value is rounded to the same decimal place as the uncertainty.
 *
 * Negative numbers use the minus sign U+2212. Very large or very small magnitudes switch to a
 * shared power of ten: "(1.23 ± 0.04) × 10⁻⁵".
 */

export interface FormattedValue {
  /** The value's digits, e.g. "0.962" or "−0.481". */
  value: string;
  /** The uncertainty's digits, when one was given. */
  uncertainty?: string;
  /** Power of ten shared by value and uncertainty, when scientific notation was needed. */
  exponent?: number;
  /** Everything together, e.g. "0.962 ± 0.004". */
  text: string;
}

export interface FormatOptions {
  /** Significant digits when there is no uncertainty (default 4). */
  significant?: number;
  /** Appended after a thin space, e.g. "mW". */
  unit?: string;
}

const MINUS = "\u2212";
const PLUS_MINUS = " ± ";
/** Outside this range of magnitudes fixed notation gets too long to read. */
const FIXED_MIN = 1e-4;
const FIXED_MAX = 1e6;
const SUPERSCRIPT: Record<string, string> = { "-": "⁻", "0": "⁰", "1": "¹", "2": "²", "3": "³", "4": "⁴", "5": "⁵", "6": "⁶", "7": "⁷", "8": "⁸", "9": "⁹" };

/** Not a number to show: NaN, ±Infinity, null or undefined. */
const NOT_SHOWN = "—";

export function formatWithUncertainty(value: number | null | undefined, uncertainty?: number | null, options: FormatOptions = {}): FormattedValue {
  if (value === null || value === undefined || !Number.isFinite(value)) return withUnit({ value: NOT_SHOWN, text: NOT_SHOWN }, options.unit);
  if (uncertainty === null || uncertainty === undefined || !Number.isFinite(uncertainty) || uncertainty < 0) {
    return withUnit(formatPlain(value, options.significant ?? 4), options.unit);
  }
  if (uncertainty === 0) {
    const plain = formatPlain(value, options.significant ?? 4);
    return withUnit({ ...plain, uncertainty: "0", text: `${plain.text}${PLUS_MINUS}0` }, options.unit);
  }

  const { mantissa, exponent } = roundUncertainty(uncertainty);
  // Decimal place of the last kept digit of the uncertainty (10^place).
  const place = exponent - (mantissa.length - 1);
  const magnitude = Math.max(Math.abs(value), uncertainty);
  if (magnitude >= FIXED_MIN && magnitude < FIXED_MAX) {
    const decimals = Math.max(0, -place);
    const v = fixed(roundToPlace(value, place), decimals);
    const u = fixed(Number(mantissa) * 10 ** place, decimals);
    return withUnit({ value: v, uncertainty: u, text: `${v}${PLUS_MINUS}${u}` }, options.unit);
  }
  const shared = Math.floor(Math.log10(magnitude));
  const decimals = Math.max(0, shared - place);
  const v = fixed(roundToPlace(value, place) / 10 ** shared, decimals);
  const u = fixed((Number(mantissa) * 10 ** place) / 10 ** shared, decimals);
  return withUnit({ value: v, uncertainty: u, exponent: shared, text: `(${v}${PLUS_MINUS}${u}) × 10${superscript(shared)}` }, options.unit);
}

/** A number without uncertainty, to `significant` digits (trailing zeros kept: they are digits). */
export function formatNumber(value: number | null | undefined, significant = 4): string {
  return formatWithUncertainty(value, undefined, { significant }).text;
}

/** A number with at most `maxDecimals` decimals and no trailing zeros, e.g. angles "22.5". */
export function formatDecimal(value: number | null | undefined, maxDecimals = 2): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return NOT_SHOWN;
  const s = value.toFixed(maxDecimals).replace(/\.?0+$/, "");
  return sign(s === "-0" ? "0" : s);
}

/** A number with exactly `decimals` decimals (zeros kept), e.g. eigenvalues "0.0003". */
export function formatFixed(value: number | null | undefined, decimals: number): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return NOT_SHOWN;
  return fixed(value, decimals);
}

/**
 * A count: a whole number, digits grouped in threes by a thin space from 10 000 on (the SI
 * style; four-digit numbers stay together), e.g. "7998", "12 345".
 */
export function formatCount(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return NOT_SHOWN;
  const s = fixed(Math.round(value), 0);
  const digits = s.replace(MINUS, "");
  if (digits.length < 5) return s;
  return (s.startsWith(MINUS) ? MINUS : "") + digits.replace(/\B(?=(\d{3})+(?!\d))/g, "\u2009");
}

/** The PDG rule: the kept digits of the uncertainty and the power of ten of its first digit. */
function roundUncertainty(u: number): { mantissa: string; exponent: number } {
  let exponent = Math.floor(Math.log10(u));
  let three = Math.round(u / 10 ** (exponent - 2));
  if (three >= 1000) {
    exponent += 1;
    three = Math.round(three / 10);
  }
  if (three < 355) return { mantissa: String(Math.round(three / 10)), exponent };
  if (three < 950) return { mantissa: String(Math.round(three / 100)), exponent };
  return { mantissa: "10", exponent: exponent + 1 };
}

function formatPlain(value: number, significant: number): FormattedValue {
  if (value === 0) return { value: "0", text: "0" };
  const magnitude = Math.abs(value);
  if (magnitude >= FIXED_MIN && magnitude < FIXED_MAX) {
    const place = Math.floor(Math.log10(magnitude)) - (significant - 1);
    const s = fixed(roundToPlace(value, place), Math.max(0, -place));
    return { value: s, text: s };
  }
  const exponent = Math.floor(Math.log10(magnitude));
  const v = fixed(value / 10 ** exponent, significant - 1);
  return { value: v, exponent, text: `${v} × 10${superscript(exponent)}` };
}

/** Rounds to a multiple of 10^place, half away from zero, without binary noise at the edge. */
function roundToPlace(value: number, place: number): number {
  const scaled = Math.abs(value) / 10 ** place;
  const r = Math.round(Number(scaled.toPrecision(15)));
  return Math.sign(value) * (place < 0 ? r / 10 ** -place : r * 10 ** place);
}

function fixed(x: number, decimals: number): string {
  const s = x.toFixed(decimals);
  return sign(/^-0(\.0*)?$/.test(s) ? s.slice(1) : s);
}

function sign(s: string): string {
  return s.startsWith("-") ? MINUS + s.slice(1) : s;
}

function superscript(n: number): string {
  return String(n)
    .split("")
    .map((c) => SUPERSCRIPT[c])
    .join("");
}

/** "(0.962 ± 0.004) mW": the unit applies to both numbers, so they are bracketed together. */
function withUnit(f: FormattedValue, unit: string | undefined): FormattedValue {
  if (!unit || f.value === NOT_SHOWN) return f;
  const body = f.uncertainty !== undefined && f.exponent === undefined ? `(${f.text})` : f.text;
  return { ...f, text: `${body}\u2009${unit}` };
}
