import Link from "next/link";
import type { ComponentProps } from "react";
import { cx } from "./class-names";

export type ButtonVariant = "primary" | "secondary" | "danger" | "ghost";
export type ButtonSize = "sm" | "md";

const base =
  "inline-flex items-center justify-center gap-1.5 rounded-md font-medium whitespace-nowrap transition-colors " +
  "disabled:cursor-not-allowed disabled:opacity-60 aria-disabled:cursor-not-allowed aria-disabled:opacity-60";

const variants: Record<ButtonVariant, string> = {
  primary: "bg-accent-700 text-white hover:bg-accent-800 shadow-sm",
  secondary: "border border-line-strong bg-surface text-ink hover:bg-surface-sunken",
  danger: "border border-danger-600 bg-surface text-danger-700 hover:bg-danger-50",
  ghost: "text-ink-muted hover:bg-surface-sunken hover:text-ink",
};

const sizes: Record<ButtonSize, string> = {
  sm: "h-7 px-2.5 text-sm",
  md: "h-9 px-3.5 text-base",
};

/** Class names for anything that should look like a button (links included). */
export function buttonClasses(variant: ButtonVariant = "primary", size: ButtonSize = "md"): string {
  return cx(base, variants[variant], sizes[size]);
}

type ButtonProps = ComponentProps<"button"> & { variant?: ButtonVariant; size?: ButtonSize };

/** A button; `type` defaults to "button" so that only explicit submit buttons submit forms. */
export function Button({ variant = "primary", size = "md", className, type = "button", ...rest }: ButtonProps) {
  return <button type={type} className={cx(buttonClasses(variant, size), className)} {...rest} />;
}

type ButtonLinkProps = ComponentProps<typeof Link> & { variant?: ButtonVariant; size?: ButtonSize };

/** A navigation link styled as a button (navigation stays a link for assistive technology). */
export function ButtonLink({ variant = "primary", size = "md", className, ...rest }: ButtonLinkProps) {
  return <Link className={cx(buttonClasses(variant, size), "no-underline hover:no-underline", className)} {...rest} />;
}
