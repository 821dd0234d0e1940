import type { ReactNode } from "react";
import { cx } from "./class-names";

export type NoticeTone = "info" | "success" | "warning" | "error";

const tones: Record<NoticeTone, string> = {
  info: "border-accent-200 bg-accent-50 text-accent-800",
  success: "border-success-600/30 bg-success-50 text-success-700",
  warning: "border-caution-600/30 bg-caution-50 text-caution-700",
  error: "border-danger-600/30 bg-danger-50 text-danger-700",
};

const prefixes: Record<NoticeTone, string> = { info: "Note", success: "Done", warning: "Warning", error: "Error" };

interface NoticeProps {
  tone?: NoticeTone;
  title?: string;
  children: ReactNode;
  className?: string;
}

/**
 * A message box for warnings and errors. Errors are announced at once (role="alert"); other tones
 * politely (role="status"). The tone is also written out, so colour is never the only signal.
 */
export function Notice({ tone = "info", title, children, className }: NoticeProps) {
  return (
    <div role={tone === "error" ? "alert" : "status"} className={cx("rounded-md border px-3 py-2 text-sm", tones[tone], className)}>
      <p className="font-semibold">{title ?? prefixes[tone]}</p>
      <div className="mt-0.5">{children}</div>
    </div>
  );
}
