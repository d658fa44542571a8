/**
 * The review state machine of a test. Pure: no database here.
 *
 *   submitted ──request_review / ask_help──▶ waiting_review ──sign_off──▶ signed_off
 *       │                                        │   ▲
 *       └──sign_off / send_back (lead directly)  send_back   resubmit (re-test)
 *                                                ▼   │
 *                                              sent_back
 *
 * signed_off is final. Asking for help on a test already waiting for review only raises the flag.
 */
import type { TestStatus } from "@/db/schema/tests";
import type { Permission } from "@/lib/permissions";

export type ReviewAction = "request_review" | "ask_help" | "sign_off" | "accept_with_reason" | "send_back" | "resubmit";
export const REVIEW_ACTIONS = ["request_review", "ask_help", "sign_off", "accept_with_reason", "send_back", "resubmit"] as const satisfies readonly ReviewAction[];

/** For each action: the statuses it may start from and where it goes. */
export const TRANSITIONS: Record<ReviewAction, { from: readonly TestStatus[]; to: TestStatus }> = {
  request_review: { from: ["submitted"], to: "waiting_review" },
  ask_help: { from: ["submitted", "waiting_review", "sent_back"], to: "waiting_review" },
  sign_off: { from: ["submitted", "waiting_review"], to: "signed_off" },
  /** Signing off a test whose curve or profile fails: the lead keeps it, and says why. */
  accept_with_reason: { from: ["submitted", "waiting_review"], to: "signed_off" },
  send_back: { from: ["submitted", "waiting_review"], to: "sent_back" },
  resubmit: { from: ["sent_back"], to: "waiting_review" },
};

/** The matrix row each action needs (the rest is visibility: the member must see the test). */
export const ACTION_PERMISSION: Record<ReviewAction, Permission> = {
  request_review: "tests.comment",
  ask_help: "tests.comment",
  resubmit: "tests.comment",
  sign_off: "tests.review",
  accept_with_reason: "tests.review",
  send_back: "tests.review",
};

/** Actions that need a note: what to do again, or what the technician needs help with. */
export const NOTE_REQUIRED: Record<ReviewAction, boolean> = {
  request_review: false,
  ask_help: true,
  sign_off: false,
  accept_with_reason: true,
  send_back: true,
  resubmit: false,
};

const STATUS_WORDS: Record<TestStatus, string> = {
  submitted: "submitted",
  waiting_review: "waiting for review",
  signed_off: "signed off",
  sent_back: "sent back",
};

export function statusWords(status: TestStatus): string {
  return STATUS_WORDS[status];
}

export type TransitionCheck = { ok: true; to: TestStatus } | { ok: false; message: string };

/** Whether `action` may move a test that is `from`; the message says why not, in plain words. */
export function checkTransition(from: TestStatus, action: ReviewAction): TransitionCheck {
  const t = TRANSITIONS[action];
  if (t.from.includes(from)) return { ok: true, to: t.to };
  const verb: Record<ReviewAction, string> = {
    request_review: "ask for review of",
    ask_help: "ask for help on",
    sign_off: "sign off",
    accept_with_reason: "accept",
    send_back: "send back",
    resubmit: "resubmit",
  };
  const hint =
    from === "signed_off"
      ? " A signed-off test is final; run a new test to record a new result."
      : from === "sent_back" && (action === "sign_off" || action === "accept_with_reason")
        ? " It was sent back: the technician resubmits it (after the re-test) first."
        : from === "waiting_review" && action === "request_review"
          ? " It is already in the review queue."
          : "";
  return { ok: false, message: `Cannot ${verb[action]} a test that is ${STATUS_WORDS[from]}.${hint}` };
}

/**
 * Whether a lead may sign a test off plainly. A test whose curve is not "tight and dry" (a leak,
 * moisture, both, or a curve that cannot be told) or that misses its acceptance profile can only
 * be accepted with a reason; a passing test is signed off and needs none.
 */
export function signOffNeedsReason(verdict: string | null | undefined, meetsProfile: boolean | null | undefined): boolean {
  return verdict !== "pass" || meetsProfile === false;
}

/** The message when the wrong one of sign off / accept with a reason is asked for. */
export function signOffRuleMessage(action: "sign_off" | "accept_with_reason", needsReason: boolean): string | null {
  if (action === "sign_off" && needsReason) {
    return "This test does not pass (its curve or its profile fails): it can only be accepted with a reason. Say why you accept it, or send it back.";
  }
  if (action === "accept_with_reason" && !needsReason) return "This test passes: sign it off; acceptance with a reason is only for a test that fails.";
  return null;
}

/**
 * The actions a member with these permissions could take on a test in this status; `needsReason`
 * (signOffNeedsReason of the current analysis) offers "accept with a reason" instead of "sign off".
 */
export function availableActions(from: TestStatus, canReview: boolean, needsReason = false): ReviewAction[] {
  return REVIEW_ACTIONS.filter(
    (a) =>
      checkTransition(from, a).ok &&
      (canReview || ACTION_PERMISSION[a] !== "tests.review") &&
      !(a === "sign_off" && needsReason) &&
      !(a === "accept_with_reason" && !needsReason),
  );
}
