// Captures the user may read, newest first, and an upload not tied to a retrofit.
import type { Metadata } from "next";
import Link from "next/link";
import { CapturePanel } from "@/components/capture/capture-panel";
import { NotAllowed } from "@/components/ui/not-allowed";
import { pageUser } from "@/lib/auth/page";
import { CAPTURE, FIELD_VIEW } from "@/lib/auth/roles";
import { formatEng } from "@/lib/engine";
import { listCaptures } from "@/lib/field/captures";

export const metadata: Metadata = { title: "Captures" };

export default async function CapturesPage() {
  const { user, allowed } = await pageUser([...FIELD_VIEW, "reviewer"]);
  if (!allowed) return <NotAllowed role={user.role} what="captures" />;
  const captures = await listCaptures({ user });
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
        <div className="overflow-x-auto">
          <table className="table-dense">
            <thead>
              <tr>
                <th scope="col">Capture</th>
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
                  <td className="num">{formatEng(c.measurement.periodS.mean, "s", 5)}</td>
                  <td className="num">{formatEng(c.measurement.highS.mean, "s", 5)}</td>
                  <td className="num">{formatEng(c.measurement.duty, "%", 4)}</td>
                  <td className="num text-ink-soft">{c.createdAt.slice(0, 10)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </div>
  );
}
