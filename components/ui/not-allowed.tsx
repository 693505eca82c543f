import Link from "next/link";

/** Shown instead of a page the signed-in role may not open. */
export function NotAllowed({ role, what }: { role: string; what: string }) {
  return (
    <section role="alert" aria-labelledby="not-allowed-title" className="panel mx-auto mt-8 max-w-xl">
      <h1 id="not-allowed-title" className="text-lg font-semibold">
        Not allowed
      </h1>
      <p className="mt-2 text-ink-soft">
        Your role ({role}) may not open {what}. If you need it, ask an admin to change your role.
      </p>
      <Link href="/" className="btn mt-4">
        Back to your start page
      </Link>
    </section>
  );
}
