import { Badge, type BadgeTone } from "@/components/ui";
import { MAIL_STATUS_TEXT, type MailStatus } from "./words";

const TONE: Record<MailStatus, BadgeTone> = { pending: "neutral", sent: "brand", failed: "attention", dead: "leak", off: "neutral" };

/** A distinct shape per status (clock, tick, circling arrow, cross), always beside the words. */
function StatusIcon({ status }: { status: MailStatus }) {
  const common = { width: 14, height: 14, viewBox: "0 0 24 24", fill: "none", stroke: "currentColor", strokeWidth: 2.6, strokeLinecap: "round" as const, strokeLinejoin: "round" as const, "aria-hidden": true };
  if (status === "sent") return <svg {...common}><path d="M5 12.5l4.5 4.5L19 7.5" /></svg>;
  if (status === "dead") return <svg {...common}><circle cx="12" cy="12" r="9" /><path d="M9 9l6 6M15 9l-6 6" /></svg>;
  if (status === "failed") return <svg {...common}><path d="M20 12a8 8 0 1 1-2.34-5.66" /><path d="M20 4v5h-5" /></svg>;
  return <svg {...common}><circle cx="12" cy="12" r="9" /><path d="M12 7v5l3 2" /></svg>;
}

export function MailStatusBadge({ status }: { status: MailStatus }) {
  return (
    <Badge tone={TONE[status]} icon={<StatusIcon status={status} />}>
      {MAIL_STATUS_TEXT[status].label}
    </Badge>
  );
}
