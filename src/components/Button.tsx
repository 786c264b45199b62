import { Link, type LinkProps } from "react-router-dom";

type Variant = "primary" | "secondary" | "quiet" | "danger";

const VARIANTS: Record<Variant, string> = {
  primary: "bg-petrol-700 text-paper-raised hover:bg-petrol-800 disabled:bg-ink-faint",
  secondary: "border border-petrol-700 bg-paper-raised text-petrol-700 hover:bg-petrol-50 disabled:border-ink-faint disabled:text-ink-faint",
  quiet: "text-petrol-700 hover:bg-paper-sunk disabled:text-ink-faint",
  danger: "bg-danger text-paper-raised hover:opacity-90",
};

/** Class names of our buttons, for the rare element that is not a <Button> (e.g. a file label). */
export function buttonClass(variant: Variant = "primary", size: "md" | "sm" = "md"): string {
  return `inline-flex items-center justify-center gap-1.5 rounded-md font-bold transition-colors disabled:cursor-not-allowed ${size === "sm" ? "px-2.5 py-1 text-sm" : "px-4 py-2"} ${VARIANTS[variant]}`;
}

export function Button({ variant = "primary", size = "md", className = "", type = "button", ...rest }: React.ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant; size?: "md" | "sm" }) {
  return <button type={type} className={`${buttonClass(variant, size)} ${className}`} {...rest} />;
}

/** A link that looks like a button (navigation, not an action). */
export function ButtonLink({ variant = "primary", size = "md", className = "", ...rest }: LinkProps & { variant?: Variant; size?: "md" | "sm" }) {
  return <Link className={`${buttonClass(variant, size)} ${className}`} {...rest} />;
}
