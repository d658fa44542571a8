"use client";

import { ReviewPanel } from "./ReviewPanel";
import { CommentThread } from "./CommentThread";
import { AuditTrail } from "./AuditTrail";
import { ShareActions } from "./ShareActions";

export interface TestReviewSectionProps {
  testId: string;
  /** reports.share for the member (owner, lead). */
  canShare: boolean;
  /** A time tapped on the test page's curve, seconds from the first row. */
  pickedSeconds?: number | null;
  onShowSeconds?: (seconds: number) => void;
  onChanged?: () => void;
}

/** Everything of the lead's desk for one test, in the order a reviewer works: review, comments, report, trail. */
export function TestReviewSection({ testId, canShare, pickedSeconds, onShowSeconds, onChanged }: TestReviewSectionProps) {
  return (
    <div className="space-y-5">
      <ReviewPanel testId={testId} onChanged={onChanged} />
      <CommentThread testId={testId} pickedSeconds={pickedSeconds} onShowSeconds={onShowSeconds} />
      <ShareActions testId={testId} canShare={canShare} />
      <AuditTrail testId={testId} />
    </div>
  );
}
