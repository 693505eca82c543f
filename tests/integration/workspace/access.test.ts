// Role and object rules of the workspace on the server: technicians read
// approved revisions of their site only; reviewers read but do not edit;
// archived retrofits stay readable and refuse changes.
import { beforeAll, describe, expect, it } from "vitest";
import { makeToken, makeUser } from "../../helpers/users";
import { newRetrofitBody, setRevisionState, jsonClient, type JsonClient } from "./fixtures";

let eng: JsonClient;
let tech: JsonClient;
let otherTech: JsonClient;
let reviewer: JsonClient;
let retrofitId: number;
let revisionId: number;

beforeAll(async () => {
  eng = jsonClient(await makeToken((await makeUser("engineer")).id));
  tech = jsonClient(await makeToken((await makeUser("technician", { site: "Test Site" })).id));
  otherTech = jsonClient(await makeToken((await makeUser("technician", { site: "Elsewhere" })).id));
  reviewer = jsonClient(await makeToken((await makeUser("reviewer")).id));
  const res = await eng("/api/v1/retrofits", { method: "POST", body: newRetrofitBody() });
  retrofitId = ((await res.json()) as { retrofit: { id: number } }).retrofit.id;
  const gen = await eng(`/api/v1/retrofits/${retrofitId}/revisions?wait=1`, { method: "POST" });
  revisionId = ((await gen.json()) as { revision: { id: number } }).revision.id;
});

describe("who may read and change what", () => {
  it("a technician gets 404 for a draft, its files and its bundle", async () => {
    for (const p of ["", "/files", "/bundle", "/files/plan.json"]) {
      expect((await tech(`/api/v1/revisions/${revisionId}${p}`)).status).toBe(404);
    }
  });

  it("a technician reads the approved revision of their site, not of another site", async () => {
    await setRevisionState(revisionId, "released");
    try {
      expect((await tech(`/api/v1/revisions/${revisionId}`)).status).toBe(200);
      expect((await tech(`/api/v1/revisions/${revisionId}/bundle`)).status).toBe(200);
      expect((await otherTech(`/api/v1/revisions/${revisionId}/bundle`)).status).toBe(404);
    } finally {
      await setRevisionState(revisionId, "prepared");
    }
  });

  it("a technician may not list, read, create or edit retrofits, nor generate", async () => {
    expect((await tech("/api/v1/retrofits")).status).toBe(403);
    expect((await tech(`/api/v1/retrofits/${retrofitId}`)).status).toBe(403);
    expect((await tech("/api/v1/retrofits", { method: "POST", body: newRetrofitBody() })).status).toBe(403);
    expect((await tech(`/api/v1/retrofits/${retrofitId}/revisions`, { method: "POST" })).status).toBe(403);
  });

  it("a reviewer reads drafts but may not edit or generate", async () => {
    expect((await reviewer(`/api/v1/revisions/${revisionId}`)).status).toBe(200);
    expect(
      (await reviewer(`/api/v1/retrofits/${retrofitId}`, { method: "PATCH", body: { name: "x" } })).status,
    ).toBe(403);
    expect((await reviewer(`/api/v1/retrofits/${retrofitId}/revisions`, { method: "POST" })).status).toBe(
      403,
    );
  });

  it("archived retrofits stay readable with their revisions and refuse changes", async () => {
    const res = await eng("/api/v1/retrofits", { method: "POST", body: newRetrofitBody() });
    const id = ((await res.json()) as { retrofit: { id: number } }).retrofit.id;
    const gen = await eng(`/api/v1/retrofits/${id}/revisions?wait=1`, { method: "POST" });
    const rev = ((await gen.json()) as { revision: { id: number } }).revision.id;
    expect((await eng(`/api/v1/retrofits/${id}`, { method: "DELETE" })).status).toBe(200);
    const read = await eng(`/api/v1/retrofits/${id}`);
    expect(read.status).toBe(200);
    expect(
      ((await read.json()) as { retrofit: { archivedAt: string | null } }).retrofit.archivedAt,
    ).not.toBeNull();
    expect((await eng(`/api/v1/revisions/${rev}/bundle`)).status).toBe(200);
    expect((await eng(`/api/v1/retrofits/${id}`, { method: "PATCH", body: { name: "y" } })).status).toBe(409);
    expect((await eng(`/api/v1/retrofits/${id}/revisions`, { method: "POST" })).status).toBe(409);
    const list = await eng(`/api/v1/retrofits?archived=only&q=${encodeURIComponent("Test")}&pageSize=100`);
    expect(((await list.json()) as { items: { id: number }[] }).items.some((i) => i.id === id)).toBe(true);
  });

  it("unknown ids are 404, not 500", async () => {
    expect((await eng("/api/v1/retrofits/999999999")).status).toBe(404);
    expect((await eng("/api/v1/revisions/abc")).status).toBe(404);
    expect((await eng("/api/v1/retrofits/999999999/revisions", { method: "POST" })).status).toBe(404);
  });
});
