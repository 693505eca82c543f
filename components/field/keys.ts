// SWR keys shared by server pages and client components (plain functions, so
// a server component may call them).
export const historyKey = (retrofitId: number) => `/api/v1/retrofits/${retrofitId}/field-checks`;
export const capturesKey = (retrofitId: number) => `/api/v1/captures?retrofitId=${retrofitId}`;
