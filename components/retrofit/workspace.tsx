"use client";
// The engineer's screen for one retrofit: asset facts, stage and targets in one
// form with live analysis and plans, generation of revisions, revision list.
// The page's first paint is "Loading the retrofit…" while the data is fetched;
// the editor (form library, schemas, the live engine) and the facts form are
// their own chunks, fetched from the first render alongside the data.
import dynamic from "next/dynamic";
import useSWR from "swr";
import { useEffect, useState } from "react";
import type { Retrofit, TargetRow } from "@/db/schema";
import { HazardCaution } from "@/components/ui/hazard-caution";
import type { Stage, StageControl } from "@/lib/engine";
import { RevisionsList, type RevisionListItem } from "./revisions-list";

const loadEditor = () => import("./workspace-editor");
const loadFacts = () => import("./facts-form");
const Loading = () => <p className="text-sm text-ink-soft">Loading the form…</p>;
const WorkspaceEditor = dynamic(() => loadEditor().then((m) => m.WorkspaceEditor), {
  ssr: false,
  loading: Loading,
});
const FactsForm = dynamic(() => loadFacts().then((m) => m.FactsForm), { ssr: false, loading: Loading });

export type RetrofitDetailJson = {
  retrofit: Omit<Retrofit, "createdAt" | "updatedAt" | "archivedAt"> & {
    createdAt: string;
    updatedAt: string;
    archivedAt: string | null;
  };
  stage: Stage | null;
  control?: StageControl | null;
  targets: TargetRow[];
  revisions: RevisionListItem[];
};

export function RetrofitWorkspace({ id, canEdit }: { id: number; canEdit: boolean }) {
  const { data, error, mutate } = useSWR<RetrofitDetailJson>(`/api/v1/retrofits/${id}`);
  const [editFacts, setEditFacts] = useState(false);
  // Start both downloads now, not when the data has arrived.
  useEffect(() => {
    void loadEditor();
    if (canEdit) void loadFacts();
  }, [canEdit]);

  if (error) {
    return (
      <p role="alert" className="field-error">
        Could not load this retrofit: {error.message} Reload the page to try again.
      </p>
    );
  }
  if (!data) return <p className="text-sm text-ink-soft">Loading the retrofit…</p>;
  const r = data.retrofit;
  const archived = r.archivedAt !== null;
  const editable = canEdit && !archived;

  return (
    <div className="space-y-4">
      <header className="space-y-1">
        <h1 className="text-xl font-semibold">{r.name}</h1>
        <p className="text-sm text-ink-soft">
          {r.site} · <span className="num">{r.assetTag}</span>
          {r.boardRef && <> · {r.boardRef}</>}
        </p>
        {r.description && <p className="text-sm">{r.description}</p>}
        {archived && (
          <p role="status" className="rounded border border-paper-line bg-paper-sunk px-2 py-1 text-sm">
            Archived on {r.archivedAt!.slice(0, 10)}: readable with its revisions, no longer editable.
          </p>
        )}
        {editable && !editFacts && (
          <button type="button" className="btn text-xs" onClick={() => setEditFacts(true)}>
            Edit asset facts
          </button>
        )}
      </header>
      {editFacts && (
        <div className="panel">
          <FactsForm
            retrofitId={r.id}
            submitLabel="Save asset facts"
            initial={{
              name: r.name,
              site: r.site,
              assetTag: r.assetTag,
              boardRef: r.boardRef,
              description: r.description,
              mainsPowered: r.mainsPowered,
              drivesThyristor: r.drivesThyristor,
            }}
            onSaved={async () => {
              setEditFacts(false);
              await mutate();
            }}
          />
        </div>
      )}
      <HazardCaution mainsPowered={r.mainsPowered} drivesThyristor={r.drivesThyristor} />
      <WorkspaceEditor
        key={r.id}
        retrofitId={r.id}
        stage={data.stage}
        control={data.control ?? null}
        targets={data.targets}
        editable={editable}
        nextNumber={(data.revisions[0]?.number ?? 0) + 1}
        onChanged={() => mutate()}
      />
      <RevisionsList retrofitId={r.id} revisions={data.revisions} />
    </div>
  );
}
