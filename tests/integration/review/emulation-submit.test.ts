// A generated revision stores per target the emulator's verdict on its built
// image (revisions.emulations) and the submit rule follows it: proven goes
// through, not proven needs unprovenReason (422 naming it). Real generator,
// real PostgreSQL, simavr from Debian (libsimavr-dev).
import { and, eq, like } from "drizzle-orm";
import { afterEach, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { mailOutbox, revisionImages } from "@/db/schema";
import { proofGate } from "@/lib/review/proof-gate";
import { submitRevision } from "@/lib/review/submit";
import type { RevisionEmulations } from "@/lib/revisions/emulations";
import { makeUser } from "../../helpers/users";
import { generate, makeRetrofit, stateOf } from "./fixtures";

describe("emulation stored with the revision, and the submit rule", () => {
  afterEach(() => {
    delete process.env.CLOCKGRAFT_EMULATORS_OFF;
  });

  it("an ATmega328P revision agrees in simavr; the image sha256 is the stored image's", async () => {
    const u = await makeUser("engineer");
    const rf = await makeRetrofit();
    const rev = await generate(rf.id, u.id);
    const row = await stateOf(rev.id);
    const e = (row.emulations as RevisionEmulations).atmega328p;
    expect(e.verdict).toBe("agrees");
    expect(e.edges!.length).toBeGreaterThanOrEqual(8);
    const [img] = await db.select().from(revisionImages).where(eq(revisionImages.revisionId, rev.id));
    const images = await db.select().from(revisionImages).where(eq(revisionImages.revisionId, rev.id));
    expect(img).toBeDefined();
    expect(images.find((i) => i.path === e.image!.path)!.sha256).toBe(e.image!.sha256);
    expect(proofGate(row, undefined)).toBeNull();
  });

  it("emulators off: not proven, submit needs unprovenReason (422 naming it)", async () => {
    process.env.CLOCKGRAFT_EMULATORS_OFF = "1";
    const u = await makeUser("engineer");
    const rf = await makeRetrofit();
    const rev = await generate(rf.id, u.id);
    const row = await stateOf(rev.id);
    expect((row.emulations as RevisionEmulations).atmega328p.verdict).toBe("not-emulated");
    expect(() => proofGate(row, undefined)).toThrow(/not proven/);
    try {
      proofGate(row, "  ");
      throw new Error("accepted a blank reason");
    } catch (err) {
      expect(err).toMatchObject({ status: 422, fields: { unprovenReason: expect.any(String) } });
    }
    expect(proofGate(row, "Bench-checked on a scope, see note")).toBe("Bench-checked on a scope, see note");
    // Submitted with the reason: the reviewers' mail carries it (lib/mail/messages.ts).
    const reviewer = await makeUser("reviewer");
    const reason = `Bench-checked on a scope, run ${rev.id}`;
    await submitRevision({ ...u, via: "token" }, rev.id, "", reason);
    expect((await stateOf(rev.id)).unprovenReason).toBe(reason);
    const mails = await db
      .select()
      .from(mailOutbox)
      .where(and(eq(mailOutbox.toAddress, reviewer.email), like(mailOutbox.body, `%${reason}%`)));
    expect(mails).toHaveLength(1);
    expect(mails[0].body).toContain(`The author's reason: ${reason}`);
  });

  it("a target that differs is refused with 409", () => {
    const row = {
      number: 7,
      buildProgress: { atmega328p: { index: 0, device: "atmega328p", step: "done" } },
      emulations: {
        atmega328p: { verdict: "differs", reason: "Differs over 3 periods on PB1: period by +500 ns." },
      },
    };
    expect(() => proofGate(row, "any reason")).toThrow(/differs from the plan/);
    try {
      proofGate(row, "any reason");
    } catch (err) {
      expect(err).toMatchObject({ status: 409 });
    }
  });
});
