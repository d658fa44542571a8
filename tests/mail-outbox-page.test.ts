import { describe, expect, it } from "vitest";
import { mailErrorInWords, MAIL_STATUS_TEXT } from "@/app/(app)/settings/mail/words";
import { navItemsFor } from "@/components/shell/nav";
import type { Role } from "@/lib/permissions";

describe("outgoing mail page: words and where it is linked (product rules, no published source)", () => {
  it("says a refused connection, a timeout, an unknown host and a refused address in plain words (nodemailer error codes, from memory)", () => {
    expect(mailErrorInWords("connect ECONNREFUSED 127.0.0.1:9")).toBe("The mail server refused the connection (it may be down).");
    expect(mailErrorInWords("Connection timeout")).toBe("The mail server did not answer in time.");
    expect(mailErrorInWords("getaddrinfo ENOTFOUND smtp.invalid")).toBe("The mail server's address could not be found.");
    expect(mailErrorInWords("Can't send mail - all recipients were rejected: 550 5.1.1 user unknown")).toMatch(/refused the address/);
  });

  it("keeps an unknown error short and quoted, and says nothing when there is no error", () => {
    const long = "weird ".repeat(60);
    const words = mailErrorInWords(long)!;
    expect(words.startsWith("The mail server answered: “weird weird")).toBe(true);
    // 139 characters of the raw text, an ellipsis, and the framing words: never the whole 360.
    expect(words.length).toBeLessThan(200);
    expect(mailErrorInWords(null)).toBeNull();
    expect(mailErrorInWords("   ")).toBeNull();
  });

  it("names every status in words, not only a colour", () => {
    expect(Object.values(MAIL_STATUS_TEXT).map((t) => t.label)).toEqual(["Waiting to send", "Sent", "Not sent yet", "Gave up", "Turned off"]);
  });

  it("links the page for owners and leads (tests.review) and for no other role", () => {
    const has = (role: Role) => navItemsFor(role).some((i) => i.href === "/settings/mail");
    expect((["owner", "lead", "technician", "trainer", "apprentice"] as Role[]).filter(has)).toEqual(["owner", "lead"]);
  });
});
