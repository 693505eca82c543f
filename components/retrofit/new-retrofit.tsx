"use client";
import { useRouter } from "next/navigation";
import { FactsForm } from "./facts-form";

export function NewRetrofit() {
  const router = useRouter();
  return <FactsForm submitLabel="Create retrofit" onSaved={(r) => router.push(`/retrofits/${r.id}`)} />;
}
