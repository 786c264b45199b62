import { formatWithUncertainty, type FormatOptions } from "@shared/format/uncertainty";

/** A number with its uncertainty and unit, in tabular figures: "0.962 ± 0.004". */
export function ValueWithError({ value, uncertainty, className = "", ...options }: { value: number | null | undefined; uncertainty?: number | null; className?: string } & FormatOptions) {
  const f = formatWithUncertainty(value, uncertainty, options);
  return <span className={`whitespace-nowrap tabular-nums ${className}`}>{f.text}</span>;
}
