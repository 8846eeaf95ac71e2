import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { CustodyCreate, CustodyKind, CustodyReceipt, InStudioItem } from "@shared/schemas/custody.ts";

export type { InStudioItem };
import type { Page } from "@shared/schemas/common.ts";
import { api, qs } from "@/lib/api-client.ts";

export type InStudioParams = { page?: number; pageSize?: number };
export type ReceiptListParams = { direction?: "in" | "out"; kind?: CustodyKind; from?: string; to?: string; page?: number; pageSize?: number };

const objectPath = (objectId: string) => `/api/objects/${encodeURIComponent(objectId)}/custody`;

export const objectCustodyQuery = (objectId: string) =>
  queryOptions({
    queryKey: ["custody", "object", objectId],
    queryFn: () => api.get<{ items: CustodyReceipt[] }>(objectPath(objectId)).then((r) => r.items),
  });

export const inStudioQuery = (params: InStudioParams) =>
  queryOptions({
    queryKey: ["custody", "in-studio", params],
    queryFn: () => api.get<Page<InStudioItem>>(`/api/custody/in-studio${qs(params)}`),
    placeholderData: keepPreviousData,
  });

export const custodyReceiptsQuery = (params: ReceiptListParams) =>
  queryOptions({
    queryKey: ["custody", "receipts", params],
    queryFn: () => api.get<Page<CustodyReceipt>>(`/api/custody/receipts${qs(params)}`),
    placeholderData: keepPreviousData,
  });

export const useObjectCustody = (objectId: string) => useQuery(objectCustodyQuery(objectId));
export const useInStudio = (params: InStudioParams) => useQuery(inStudioQuery(params));
export const useCustodyReceipts = (params: ReceiptListParams) => useQuery(custodyReceiptsQuery(params));

/** Records a hand-over. It moves the object and writes its history, so those are fetched again too. */
export function useRecordCustody(objectId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CustodyCreate) => api.post<CustodyReceipt>(objectPath(objectId), body),
    onSuccess: () => {
      qc.invalidateQueries({ queryKey: ["custody"] });
      qc.invalidateQueries({ queryKey: ["objects"] });
      qc.invalidateQueries({ queryKey: ["history"] });
    },
  });
}
