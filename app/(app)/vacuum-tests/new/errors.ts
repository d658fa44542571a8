import { ApiError } from "@/lib/client/api";

export interface ErrorAdvice {
  title: string;
  message: string;
  /** What to do next, in plain words. */
  todo: string;
  canRetry: boolean;
  signIn?: boolean;
}

/** A failed upload in plain words: what happened and what to do. */
export function adviseOnError(err: unknown): ErrorAdvice {
  if (!(err instanceof ApiError)) {
    return { title: "Something went wrong", message: String((err as Error)?.message ?? err), todo: "Try again.", canRetry: true };
  }
  switch (err.status) {
    case 0:
      return err.code === "offline"
        ? { title: "You are offline", message: "Nothing was sent.", todo: "Retry when you have signal. The same file is kept, and it is never saved twice.", canRetry: true }
        : { title: "No answer from Riseline", message: "The signal may be weak.", todo: "Retry. If the first try did reach Riseline, the test is not saved twice.", canRetry: true };
    case 413:
      return { title: "The file is too large", message: err.message, todo: "Export a shorter period from the gauge (up to 64 MB) and try again.", canRetry: false };
    case 415:
      return { title: "This is not a gauge log", message: err.message, todo: "Export the log from the gauge as CSV or text and choose that file.", canRetry: false };
    case 422:
      return { title: "The log could not be read", message: err.message, todo: "Check the file at that place, export it again from the gauge, or type the readings instead.", canRetry: false };
    case 400:
      return { title: "A field is not valid", message: err.message, todo: "Correct it and send again.", canRetry: false };
    case 401:
      return { title: "Your session ended", message: err.message, todo: "Sign in again, then send the file again.", canRetry: false, signIn: true };
    case 403:
      return { title: "Not allowed", message: err.message, todo: "Ask your shop’s owner or lead for access.", canRetry: false };
    case 503:
      return { title: "Nothing was saved", message: err.message, todo: "Try again in a moment.", canRetry: true };
    default:
      return { title: "Something went wrong", message: err.message, todo: "Try again. Nothing is saved twice.", canRetry: true };
  }
}
