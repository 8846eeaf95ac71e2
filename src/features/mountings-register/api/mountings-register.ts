import { keepPreviousData, queryOptions, useQuery } from "@tanstack/react-query";
import type { MountingListPage, MountingListQuery } from "@shared/schemas/mountings.ts";
import { api, qs } from "@/lib/api-client.ts";

export type MountingListParams = Partial<MountingListQuery>;

// Under ["mountings"], so every change to a mounting record (which invalidates that key) refreshes the register too.
export const mountingsRegisterQuery = (params: MountingListParams) =>
  queryOptions({
    queryKey: ["mountings", "register", params],
    queryFn: () => api.get<MountingListPage>(`/api/mountings${qs(params)}`),
    placeholderData: keepPreviousData,
  });

export const useMountingsRegister = (params: MountingListParams, enabled = true) => useQuery({ ...mountingsRegisterQuery(params), enabled });
