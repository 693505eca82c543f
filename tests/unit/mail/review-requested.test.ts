// The "sent for checking" mail to each reviewer (lib/mail/messages.ts): when
// the author submitted with a target not proven in the emulator, the mail
// carries the author's reason (the submit rule, lib/review/proof-gate.ts,
// stores the same text); a proven revision's mail says nothing about it.
// Common practice, no source: a reviewer reads the mail before opening the page.
import { beforeAll, describe, expect, it } from "vitest";
import { reviewRequestedMail } from "@/lib/mail/messages";

const base = {
  revision: { id: 41, number: 3 },
  retrofit: { id: 7, name: "Backwash valve hold-off", site: "Tollbridge Works", assetTag: "TB-BWV-1" },
  author: { name: "Tomas Reiff", email: "engineer@ostberg.test" },
  reviewers: [
    { name: "Priya Castell", email: "reviewer@ostberg.test" },
    { name: "Ilse Marant", email: "admin@ostberg.test" },
  ],
  note: "",
};

describe("review-requested mail", () => {
  beforeAll(() => {
    process.env.DATABASE_URL ??= "postgres://postgres@127.0.0.1:1/none";
    process.env.NEXTAUTH_SECRET ??= "unit-test-secret-0000000000000000000000";
    process.env.NEXTAUTH_URL ??= "http://127.0.0.1:3000";
  });

  it("carries the unproven reason to every reviewer", () => {
    const mails = reviewRequestedMail({
      ...base,
      unprovenReason: "Checked on the bench with a scope; the 5 s pulse is past the emulator budget.",
    });
    expect(mails.map((m) => m.to)).toEqual(["reviewer@ostberg.test", "admin@ostberg.test"]);
    for (const m of mails)
      expect(m.body).toContain(
        "Not every target was proven in the emulator. The author's reason: Checked on the bench with a scope; the 5 s pulse is past the emulator budget.",
      );
  });

  it("says nothing about proof when there is no reason", () => {
    for (const unprovenReason of [undefined, null, ""]) {
      const [m] = reviewRequestedMail({ ...base, unprovenReason });
      expect(m.body).not.toMatch(/proven/);
      expect(m.body).toContain("Tomas Reiff sent Backwash valve hold-off (TB-BWV-1) r3 at Tollbridge Works");
    }
  });
});
