// The channel and probe choice of an upload or a re-measure (capture.md
// "Input"; the routes app/api/v1/captures/*). Channel numbers are 1-based as on
// the scope's front panel; 1x, 10x and 100x are the usual passive probe ratios
// (common practice, no source); 16 channels is our own upper limit.
import { describe, expect, it } from "vitest";
import { choiceOf, choiceOptions, MAX_CHANNEL, PROBE_CHOICES, readChoice } from "@/lib/capture";

const CHANNEL_MSG = "Channel is a whole number from 1 to 16.";
const PROBE_MSG = "Probe attenuation is one of 1x, 10x, 100x.";

describe("readChoice", () => {
  it("nothing given is channel 1 with a 1x probe", () => {
    expect(readChoice({})).toEqual({ ok: true, choice: { channel: 1, probe: 1 } });
    expect(readChoice({ channel: null, probe: null })).toEqual({
      ok: true,
      choice: { channel: 1, probe: 1 },
    });
    expect(readChoice({ channel: "", probe: "" })).toEqual({ ok: true, choice: { channel: 1, probe: 1 } });
  });

  it("numbers from JSON and digit strings from a query read the same", () => {
    expect(readChoice({ channel: 2, probe: 10 })).toEqual({ ok: true, choice: { channel: 2, probe: 10 } });
    expect(readChoice({ channel: " 2 ", probe: "100" })).toEqual({
      ok: true,
      choice: { channel: 2, probe: 100 },
    });
    expect(readChoice({ channel: "16" })).toEqual({ ok: true, choice: { channel: 16, probe: 1 } });
    expect(readChoice({ probe: "10" })).toEqual({ ok: true, choice: { channel: 1, probe: 10 } });
  });

  it.each([0, 17, 1.5, -1, "0", "2.5", "two", "x", true])(
    "channel %j is refused with the range",
    (channel) => {
      expect(readChoice({ channel })).toEqual({ ok: false, fields: { channel: CHANNEL_MSG } });
    },
  );

  it.each([2, 1000, 0, "10x", "ten", "1.0", false])("probe %j is refused with the choices", (probe) => {
    expect(readChoice({ probe })).toEqual({ ok: false, fields: { probe: PROBE_MSG } });
  });

  it("both wrong: both fields named", () => {
    expect(readChoice({ channel: 99, probe: 3 })).toEqual({
      ok: false,
      fields: { channel: CHANNEL_MSG, probe: PROBE_MSG },
    });
  });

  it("the messages follow the limits", () => {
    expect(MAX_CHANNEL).toBe(16);
    expect(PROBE_CHOICES).toEqual([1, 10, 100]);
  });
});

describe("the choice as parser options and back", () => {
  it("channel 3 is the third voltage column (0-based 2); the probe passes through", () => {
    expect(choiceOptions({ channel: 3, probe: 10 })).toEqual({ voltageColumn: 2, probeAttenuation: 10 });
  });

  it("a stored measurement gives its choice back; an older one without scaling is channel 1, 1x", () => {
    const scaling = {
      voltageColumn: 1,
      voltageColumns: 2,
      unit: "V",
      unitFrom: "column" as const,
      unitScale: 1,
      scale: 1,
      offsetV: 0,
      probe: 100,
      headerProbe: null,
    };
    expect(choiceOf({ scaling })).toEqual({ channel: 2, probe: 100 });
    expect(choiceOf({})).toEqual({ channel: 1, probe: 1 });
  });
});
