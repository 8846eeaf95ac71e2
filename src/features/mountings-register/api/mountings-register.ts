import { keepPreviousData, queryOptions, useQuery } from "@tanstack/react-query";
import type { MountingListPage, MountingListQuery } from "@shared/schemas/mountings.ts";
import { api, qs } from "@/lib/api-client.ts";
import { rootKeys } from "@/lib/query-keys.ts";

export type MountingListParams = Partial<MountingListQuery>;

// Under the mountings root, so every change to a mounting record (which invalidates that key) refreshes the register too.
export const mountingsRegisterKeys = {
  all: [...rootKeys.mountings, "register"] as const,
  list: (params: MountingListParams) => [...rootKeys.mountings, "register", params] as const,
};

export const mountingsRegisterQuery = (params: MountingListParams) =>
  queryOptions({
    queryKey: mountingsRegisterKeys.list(params),
    queryFn: () => api.get<MountingListPage>(`/api/mountings${qs(params)}`),
    placeholderData: keepPreviousData,
  });

export const useMountingsRegister = (params: MountingListParams, enabled = true) => useQuery({ ...mountingsRegisterQuery(params), enabled });
