/** Names shared by the page and the service worker. */
export const PAGES_CACHE = "riseline-pages";
/** Pages kept for starting without signal. */
export const OFFLINE_PAGES = ["/vacuum-tests/new"];
export const SYNC_TAG = "riseline-outbox";
