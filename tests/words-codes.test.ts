/** Codes shown as words and a charge in the shop's units (pure). */
import { describe, expect, it } from "vitest";
import { codeWords, isSnakeCaseCode } from "@/lib/words/codes";
import { chargeWords, KG_PER_POUND } from "@/lib/words/charge";

describe("codes as words (product rule: no raw code on a screen)", () => {
  it("known system kinds have their own words; any other snake_case code reads as a phrase; plain text is kept", () => {
    expect(codeWords("heat_pump")).toBe("Heat pump");
    expect(codeWords("split_ac")).toBe("Split air conditioner");
    expect(codeWords("rooftop_gas_pack")).toBe("Rooftop gas pack");
    expect(codeWords("Split, ducted")).toBe("Split, ducted");
    expect(codeWords(null)).toBeNull();
    expect(isSnakeCaseCode("leak_and_moisture")).toBe(true);
    expect(isSnakeCaseCode("walk-in")).toBe(false);
  });
});

describe("a charge in pounds and ounces (1 lb = 0.45359237 kg exactly, NIST SP 811 appendix B.8)", () => {
  it("2.5 kg is 5 lb 8 oz (5.5116 lb → 88.19 oz → 88 oz), with the kilograms beside", () => {
    expect(KG_PER_POUND).toBe(0.45359237);
    expect(chargeWords(2.5)).toBe("5 lb 8 oz (2.5 kg)");
    expect(chargeWords(KG_PER_POUND * 3)).toBe("3 lb (1.36 kg)");
    expect(chargeWords(0.2)).toBe("7 oz (0.2 kg)");
    // 15.6 oz rounds to 16 oz and carries into a pound
    expect(chargeWords((KG_PER_POUND * 15.6) / 16)).toBe("1 lb (0.44 kg)");
  });
});
