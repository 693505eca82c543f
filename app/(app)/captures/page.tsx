// Captures the user may read, newest first, and an upload not tied to a retrofit.
import type { Metadata } from "next";
import Link from "next/link";
import { CapturePanel } from "@/components/capture/capture-panel";
import { NotAllowed } from "@/components/ui/not-allowed";
import { pageUser } from "@/lib/auth/page";
import { CAPTURE, FIELD_VIEW } from "@/lib/auth/roles";
import { formatEng } from "@/lib/engine";
import { assetTagsFor, listCaptures } from "@/lib/field/captures";

export const metadata: Metadata = { title: "Captures" };

export default async function CapturesPage() {
  const { user, allowed } = await pageUser([...FIELD_VIEW, "reviewer"]);
  if (!allowed) return <NotAllowed role={user.role} what="captures" />;
  const captures = await listCaptures({ user });
  const tags = await assetTagsFor(captures.flatMap((c) => (c.retrofitId === null ? [] : [c.retrofitId])));
  const asset = (id: number | null) => (id === null ? "—" : (tags.get(id) ?? "—"));
  const when = (iso: string) => `${iso.slice(0, 16).replace("T", " ")} UTC`;
  return (
    <div className="flex flex-col gap-4">
      <h1 className="text-xl font-semibold">Captures</h1>
      {CAPTURE.includes(user.role) && (
        <section className="panel">
          <CapturePanel />
        </section>
      )}
      {captures.length === 0 ? (
        <p className="text-ink-soft">
          No captures yet. Upload a CSV or TSV export from the oscilloscope above.
        </p>
      ) : (
        <>
          {/* Phone: one card per capture, the four things a technician looks for. */}
          <ul className="flex flex-col gap-2 md:hidden" data-testid="capture-cards">
            {captures.map((c) => (
              <li key={c.id} className="panel p-3">
                <Link className="block break-all font-medium underline" href={`/captures/${c.id}`}>
                  #{c.id} {c.fileName}
                </Link>
                <dl className="mt-1 grid grid-cols-[auto_1fr] gap-x-3 text-sm">
                  <dt className="text-ink-soft">When</dt>
                  <dd className="num">{when(c.createdAt)}</dd>
                  <dt className="text-ink-soft">Asset</dt>
                  <dd className="num">{asset(c.retrofitId)}</dd>
                  <dt className="text-ink-soft">Period</dt>
                  <dd className="num">{formatEng(c.measurement.periodS.mean, "s", 5)}</dd>
                  <dt className="text-ink-soft">Duty</dt>
                  <dd className="num">{formatEng(c.measurement.duty, "%", 4)}</dd>
                </dl>
              </li>
            ))}
          </ul>
          <div className="hidden overflow-x-auto md:block">
            <table className="table-dense">
              <thead>
                <tr>
                  <th scope="col">Capture</th>
                  <th scope="col">Asset</th>
                  <th scope="col">Period</th>
                  <th scope="col">High time</th>
                  <th scope="col">Duty</th>
                  <th scope="col">Uploaded</th>
                </tr>
              </thead>
              <tbody>
                {captures.map((c) => (
                  <tr key={c.id}>
                    <td>
                      <Link className="underline" href={`/captures/${c.id}`}>
                        #{c.id} {c.fileName}
                      </Link>
                    </td>
                    <td className="num">{asset(c.retrofitId)}</td>
                    <td className="num">{formatEng(c.measurement.periodS.mean, "s", 5)}</td>
                    <td className="num">{formatEng(c.measurement.highS.mean, "s", 5)}</td>
                    <td className="num">{formatEng(c.measurement.duty, "%", 4)}</td>
                    <td className="num text-ink-soft">{when(c.createdAt)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </>
      )}
    </div>
  );
}
