export { ReviewPanel, type ReviewPanelProps } from "./ReviewPanel";
export { CommentThread, type CommentThreadProps } from "./CommentThread";
export { AuditTrail, type AuditTrailProps } from "./AuditTrail";
export { ShareActions, type ShareActionsProps } from "./ShareActions";
export { TestReviewSection, type TestReviewSectionProps } from "./TestReviewSection";
export { Sparkline } from "./Sparkline";
