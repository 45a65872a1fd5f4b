import type { ButtonHTMLAttributes } from "react";

const variants = {
  primary: "bg-pine-600 text-white hover:bg-pine-700 disabled:bg-pine-600/50",
  secondary: "bg-paper-raised text-ink border border-line hover:border-line-strong hover:bg-paper-sunk disabled:text-ink-faint",
  quiet: "text-pine-700 hover:bg-pine-50 disabled:text-ink-faint",
  danger: "bg-paper-raised text-alarm-700 border border-alarm-500/40 hover:bg-alarm-50",
} as const;

export type ButtonVariant = keyof typeof variants;

export function buttonClass(variant: ButtonVariant = "primary", size: "sm" | "md" = "md") {
  const pad = size === "sm" ? "px-2.5 py-1 text-sm" : "px-4 py-2 text-sm";
  return `inline-flex items-center justify-center gap-2 rounded-md font-semibold transition-colors disabled:cursor-not-allowed ${pad} ${variants[variant]}`;
}

export function Button({ variant = "primary", size = "md", className = "", ...props }: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: ButtonVariant; size?: "sm" | "md" }) {
  return <button type="button" {...props} className={`${buttonClass(variant, size)} ${className}`} />;
}
