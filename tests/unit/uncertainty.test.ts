import { describe, expect, it } from "vitest";
import { formatCount, formatDecimal, formatFixed, formatNumber, formatWithUncertainty } from "@shared/format/uncertainty";

const text = (v: number | null | undefined, u?: number | null, unit?: string) => formatWithUncertainty(v, u, { unit }).text;

describe("formatWithUncertainty — digits by the Particle Data Group rounding rule", () => {
  // PDG, Review of Particle Physics, Introduction, "Rounding" (examples quoted from memory):
  // 0.827 ± 0.119 appears as 0.83 ± 0.12, and 0.827 ± 0.367 as 0.8 ± 0.4.
  it("keeps two digits when the uncertainty starts with 100–354", () => {
    expect(text(0.827, 0.119)).toBe("0.83 ± 0.12");
    expect(text(0.9617, 0.00354)).toBe("0.9617 ± 0.0035");
  });
  it("keeps one digit when the uncertainty starts with 355–949", () => {
    expect(text(0.827, 0.367)).toBe("0.8 ± 0.4");
    expect(text(0.96213, 0.0041)).toBe("0.962 ± 0.004");
    expect(text(0.96213, 0.00355)).toBe("0.962 ± 0.004");
  });
  it("rounds 950–999 up to the next power of ten and keeps two digits", () => {
    expect(text(0.5, 0.0097)).toBe("0.500 ± 0.010");
    expect(text(12.34, 0.98)).toBe("12.3 ± 1.0");
  });
  it("rounds the value to the decimal place of the uncertainty, including integer places", () => {
    expect(text(2.7071, 0.0234)).toBe("2.707 ± 0.023");
    expect(text(12345, 110)).toBe("12350 ± 110");
    expect(text(12345, 600)).toBe("12300 ± 600");
  });
  it("writes negatives with a true minus sign and never shows −0", () => {
    expect(text(-0.48149, 0.0062)).toBe("−0.481 ± 0.006");
    expect(text(-0.0001, 0.004)).toBe("0.000 ± 0.004");
  });
  it("shares a power of ten for very small and very large magnitudes", () => {
    const f = formatWithUncertainty(1.234e-5, 4.1e-7);
    expect(f).toMatchObject({ value: "1.23", uncertainty: "0.04", exponent: -5 });
    expect(f.text).toBe("(1.23 ± 0.04) × 10⁻⁵");
    expect(text(2.5e7, 1.2e6)).toBe("(2.50 ± 0.12) × 10⁷");
  });
  it("brackets value and uncertainty before a unit", () => {
    expect(text(5.02, 0.013, "mW")).toBe("(5.020 ± 0.013)\u2009mW");
    expect(text(405, undefined, "nm")).toBe("405.0\u2009nm");
  });
  it("shows a value alone to four significant digits when the uncertainty is missing or unusable", () => {
    expect(text(0.96213)).toBe("0.9621");
    expect(text(0.96213, null)).toBe("0.9621");
    expect(text(0.96213, Number.NaN)).toBe("0.9621");
    expect(text(2.828427)).toBe("2.828");
    expect(text(0)).toBe("0");
  });
  it("shows an exact zero uncertainty as ± 0", () => {
    expect(text(1, 0)).toBe("1.000 ± 0");
  });
  it("shows a dash, without a unit, for values that are not numbers", () => {
    expect(text(Number.NaN, 0.1, "mW")).toBe("—");
    expect(text(null)).toBe("—");
    expect(text(Number.POSITIVE_INFINITY)).toBe("—");
  });
});

describe("formatNumber and formatDecimal", () => {
  it("formats to a number of significant digits", () => {
    expect(formatNumber(0.123456, 3)).toBe("0.123");
    expect(formatNumber(-1234.5, 3)).toBe("−1230");
  });
  it("writes angles with at most the given decimals and no trailing zeros", () => {
    expect(formatDecimal(22.5)).toBe("22.5");
    expect(formatDecimal(45)).toBe("45");
    expect(formatDecimal(-22.5)).toBe("−22.5");
    expect(formatDecimal(-0.001)).toBe("0");
    expect(formatDecimal(12.3456)).toBe("12.35");
  });
});

describe("formatFixed and formatCount", () => {
  it("keeps a fixed number of decimals, zeros included", () => {
    expect(formatFixed(0.000324, 4)).toBe("0.0003");
    expect(formatFixed(5e-19, 4)).toBe("0.0000");
    expect(formatFixed(-0.00581, 4)).toBe("−0.0058");
  });
  it("writes counts as whole numbers, grouped by thin spaces from five digits on (SI style)", () => {
    expect(formatCount(7998)).toBe("7998");
    expect(formatCount(12345)).toBe("12\u2009345");
    expect(formatCount(1234567.4)).toBe("1\u2009234\u2009567");
    expect(formatCount(null)).toBe("—");
  });
});
