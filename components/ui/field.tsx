import type { ComponentProps, ReactNode } from "react";
import { cx } from "./class-names";

/** Element ids that tie a control to its hint and error text (`aria-describedby`). */
export interface FieldDescription {
  id: string;
  describedBy: string | undefined;
  invalid: boolean;
}

interface FieldProps {
  /** The control's id; the label points at it and hint/error ids derive from it. */
  id: string;
  label: string;
  /** What the field expects, shown before the user gets it wrong. */
  hint?: ReactNode;
  /** Messages from validation (e.g. ActionState.fieldErrors[name]); shown under the control. */
  errors?: readonly string[];
  /** Marks the label as optional rather than marking required fields with symbols. */
  optional?: boolean;
  children: (description: FieldDescription) => ReactNode;
  className?: string;
}

/** Label + control + hint + error, wired for screen readers: errors point to the field. */
export function Field({ id, label, hint, errors, optional, children, className }: FieldProps) {
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = errors && errors.length > 0 ? `${id}-error` : undefined;
  const describedBy = [errorId, hintId].filter(Boolean).join(" ") || undefined;
  return (
    <div className={cx("flex flex-col gap-1", className)}>
      <label htmlFor={id} className="text-sm font-medium text-ink">
        {label}
        {optional ? <span className="ml-1 font-normal text-ink-faint">(optional)</span> : null}
      </label>
      {children({ id, describedBy, invalid: Boolean(errorId) })}
      {hint ? (
        <p id={hintId} className="text-xs text-ink-muted">
          {hint}
        </p>
      ) : null}
      {errorId ? (
        <p id={errorId} className="text-xs font-medium text-danger-700">
          {errors?.join(" ")}
        </p>
      ) : null}
    </div>
  );
}

/** Control height: "regular" in forms, "compact" inside table rows. Width comes from the caller. */
export type ControlDensity = "regular" | "compact";

const controlClasses =
  "rounded-md border border-line-strong bg-surface text-ink shadow-inner shadow-black/[0.02] " +
  "placeholder:text-ink-faint focus-visible:border-accent-600 aria-invalid:border-danger-600 " +
  "disabled:bg-surface-sunken disabled:text-ink-faint";

const densityClasses: Record<ControlDensity, string> = {
  regular: "h-9 px-2.5 text-base",
  compact: "h-7 px-2 text-sm",
};

type ControlProps<T extends "input" | "select"> = ComponentProps<T> & { density?: ControlDensity };

/** A bare text input with the kit's look. Prefer {@link TextField}, which adds the label. */
export function Input({ className, density = "regular", ...rest }: ControlProps<"input">) {
  return <input className={cx(controlClasses, densityClasses[density], className)} {...rest} />;
}

/** A bare native select with the kit's look. Prefer {@link SelectField}, which adds the label. */
export function Select({ className, density = "regular", ...rest }: ControlProps<"select">) {
  return <select className={cx(controlClasses, densityClasses[density], "pr-7", className)} {...rest} />;
}

type FieldFrameProps = Pick<FieldProps, "label" | "hint" | "errors" | "optional" | "className"> & { name: string; id?: string };

type TextFieldProps = FieldFrameProps & Omit<ComponentProps<"input">, "id" | "name" | "className">;

/** A labelled text input with hint and error text. */
export function TextField({ label, hint, errors, optional, className, name, id, ...input }: TextFieldProps) {
  return (
    <Field id={id ?? name} label={label} hint={hint} errors={errors} optional={optional} className={className}>
      {(d) => (
        <Input
          id={d.id}
          name={name}
          className="w-full"
          aria-describedby={d.describedBy}
          aria-invalid={d.invalid || undefined}
          {...input}
        />
      )}
    </Field>
  );
}

export interface SelectOption {
  value: string;
  label: string;
}

type SelectFieldProps = FieldFrameProps &
  Omit<ComponentProps<"select">, "id" | "name" | "className" | "children"> & { options: readonly SelectOption[] };

/** A labelled native select with hint and error text. */
export function SelectField({ label, hint, errors, optional, className, name, id, options, ...select }: SelectFieldProps) {
  return (
    <Field id={id ?? name} label={label} hint={hint} errors={errors} optional={optional} className={className}>
      {(d) => (
        <Select
          id={d.id}
          name={name}
          className="w-full"
          aria-describedby={d.describedBy}
          aria-invalid={d.invalid || undefined}
          {...select}
        >
          {options.map((o) => (
            <option key={o.value} value={o.value}>
              {o.label}
            </option>
          ))}
        </Select>
      )}
    </Field>
  );
}
