import type { ButtonHTMLAttributes } from "react";

type Variant = "primary" | "secondary" | "danger" | "ghost";
const STYLES: Record<Variant, string> = {
  primary: "bg-accent text-accent-ink hover:opacity-90 border border-transparent",
  secondary: "bg-surface-2 text-ink border border-line hover:bg-surface-3",
  danger: "bg-surface text-danger border border-danger/60 hover:bg-danger/10",
  ghost: "text-ink hover:bg-surface-3 border border-transparent",
};

export function Button({ variant = "secondary", className = "", ...rest }: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant }) {
  return (
    <button
      className={`inline-flex items-center gap-1.5 rounded px-3 py-1.5 text-sm font-medium disabled:cursor-not-allowed disabled:opacity-50 ${STYLES[variant]} ${className}`}
      {...rest}
    />
  );
}
