/** Minimal structured logging to stderr (one JSON line per event). */
function write(level: "info" | "warn" | "error", message: string, fields?: Record<string, unknown>) {
  process.stderr.write(JSON.stringify({ level, time: new Date().toISOString(), message, ...fields }) + "\n");
}

export const log = {
  info: (m: string, f?: Record<string, unknown>) => write("info", m, f),
  warn: (m: string, f?: Record<string, unknown>) => write("warn", m, f),
  error: (m: string, f?: Record<string, unknown>) => write("error", m, f),
};
