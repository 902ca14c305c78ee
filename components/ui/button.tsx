import type { ButtonHTMLAttributes } from "react";

type Variant = "primary" | "secondary" | "ghost" | "danger";

const styles: Record<Variant, string> = {
  primary: "bg-copper text-white hover:bg-copper-strong border-transparent",
  secondary: "bg-panel text-ink border-line hover:bg-sunken",
  ghost: "bg-transparent text-ink-muted border-transparent hover:bg-sunken hover:text-ink",
  danger: "bg-bad text-white border-transparent hover:opacity-90",
};

export function buttonClass(variant: Variant = "secondary", extra = "") {
  return `inline-flex items-center justify-center gap-1.5 rounded border px-3 py-1.5 text-sm font-medium transition-colors disabled:cursor-not-allowed disabled:opacity-50 ${styles[variant]} ${extra}`;
}

export function Button({
  variant = "secondary",
  className = "",
  type = "button",
  ...props
}: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant }) {
  return <button type={type} className={buttonClass(variant, className)} {...props} />;
}
