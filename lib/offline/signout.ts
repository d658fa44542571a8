/**
 * Sign-out clears the phone's outbox and the pages kept for offline use, after a warning when
 * unsent tests would be lost (the outbox belongs to the person signed in).
 */
import { PAGES_CACHE } from "./constants";
import { clearOutbox, listAllCaptures } from "./outbox";
import { isUnsent } from "./rules";

/** False when the person chose to keep their unsent tests (and stay signed in). */
export async function clearPhoneOnSignOut(confirmLoss: (unsent: number) => boolean): Promise<boolean> {
  let unsent = 0;
  try {
    unsent = (await listAllCaptures()).filter(isUnsent).length;
  } catch {
    unsent = 0;
  }
  if (unsent > 0 && !confirmLoss(unsent)) return false;
  try {
    await clearOutbox();
    if (typeof caches !== "undefined") await caches.delete(PAGES_CACHE);
  } catch {
    // storage not available: nothing kept
  }
  return true;
}
