import Link from "next/link";
import type { ButtonHTMLAttributes, ReactNode } from "react";

const base =
  "inline-flex min-h-touch items-center justify-center rounded-xl px-5 text-base font-bold disabled:opacity-50 disabled:cursor-not-allowed";
const variants = {
  primary: "bg-accent text-accent-ink",
  secondary: "border-2 border-ink bg-raised text-ink",
  danger: "border-2 border-danger bg-raised text-danger",
} as const;
type Variant = keyof typeof variants;

/** Classes for a touch-sized button (≥ 64 px tall). */
export function buttonClass(variant: Variant = "primary", extra = ""): string {
  return `${base} ${variants[variant]} ${extra}`;
}

export function Button({ variant = "primary", className = "", ...props }: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant }) {
  return <button className={buttonClass(variant, className)} {...props} />;
}

export function ButtonLink({ href, children, variant = "primary", className = "" }: { href: string; children: ReactNode; variant?: Variant; className?: string }) {
  return (
    <Link href={href} className={buttonClass(variant, className)}>
      {children}
    </Link>
  );
}
