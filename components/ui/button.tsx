import type { ButtonHTMLAttributes } from "react";

const variants = {
  primary: "bg-copper-600 text-white hover:bg-copper-700 disabled:bg-ink-300",
  secondary: "bg-white text-ink-800 ring-1 ring-ink-300 hover:bg-ink-100 disabled:text-ink-400",
  danger: "bg-signal-fault text-white hover:bg-[#861b15] disabled:bg-ink-300",
  quiet: "text-ink-700 hover:bg-ink-100 disabled:text-ink-400",
} as const;

export type ButtonVariant = keyof typeof variants;

export function buttonClass(variant: ButtonVariant = "primary", extra = ""): string {
  return `inline-flex items-center gap-1.5 rounded px-3 py-1.5 text-sm font-medium transition-colors disabled:cursor-not-allowed ${variants[variant]} ${extra}`;
}

export function Button({ variant = "primary", className = "", type = "button", ...rest }: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: ButtonVariant }) {
  return <button type={type} className={buttonClass(variant, className)} {...rest} />;
}
