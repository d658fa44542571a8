/**
 * durationWords: the one duration formatter. The carrying rule is arithmetic (60 s = 1 min,
 * 60 min = 1 h); the wording is our own (common practice, no published source).
 */
import { describe, expect, it } from "vitest";
import { durationWords } from "@/analysis/shared/format";

/** Reads "1 h 05 min", "12 min 5 s", "45 s" back into seconds and the parts as written. */
function parse(words: string): { seconds: number; parts: Record<string, number> } {
  const parts: Record<string, number> = {};
  for (const m of words.replace("−", "").matchAll(/(\d+) (h|min|s)/g)) parts[m[2]] = Number(m[1]);
  const seconds = (parts.h ?? 0) * 3600 + (parts.min ?? 0) * 60 + (parts.s ?? 0);
  return { seconds: words.startsWith("−") ? -seconds : seconds, parts };
}

describe("durationWords — one formatter, correct carrying (common practice, no published source)", () => {
  it("writes the usual shapes", () => {
    expect(durationWords(0)).toBe("0 s");
    expect(durationWords(45.4)).toBe("45 s");
    expect(durationWords(720)).toBe("12 min");
    expect(durationWords(725)).toBe("12 min 5 s");
    expect(durationWords(3600)).toBe("1 h");
    expect(durationWords(3900)).toBe("1 h 05 min");
    expect(durationWords(-90)).toBe("−1 min 30 s");
    expect(durationWords(NaN)).toBe("—");
  });

  it("never writes 60 s or 60 min: 59.6 s, 3,599.6 s and 7,170 s carry over", () => {
    expect(durationWords(59.6)).toBe("1 min");
    expect(durationWords(3599.6)).toBe("1 h");
    expect(durationWords(7170)).toBe("2 h");
    expect(durationWords(3570)).toBe("59 min 30 s");
  });

  it("for every duration to 30 h: no part reaches its carry and the words are within half the last unit shown", () => {
    const wrong: string[] = [];
    for (let t = 0; t < 30 * 3600; t += 0.7) {
      const words = durationWords(t);
      const { seconds, parts } = parse(words);
      // Rounded to whole seconds under an hour, whole minutes from an hour on.
      const half = t < 3599.5 ? 0.5 : 30;
      if ((parts.s ?? 0) >= 60 || (parts.min ?? 0) >= 60 || Math.abs(seconds - t) > half + 1e-9) wrong.push(`${t} → ${words}`);
    }
    expect(wrong).toEqual([]);
  });
});
