"use client";

import { SessionProvider } from "next-auth/react";
import { SWRConfig } from "swr";
import { fetchJson } from "@/lib/client/fetch-json";

export function Providers({ children }: { children: React.ReactNode }) {
  return (
    <SessionProvider refetchOnWindowFocus={false}>
      <SWRConfig value={{ fetcher: fetchJson, revalidateOnFocus: false }}>{children}</SWRConfig>
    </SessionProvider>
  );
}
