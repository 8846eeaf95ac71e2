import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { CustodyCreate, CustodyKind, CustodyReceipt, InStudioItem } from "@shared/schemas/custody.ts";

export type { InStudioItem };
import type { Page } from "@shared/schemas/common.ts";
import { api, qs } from "@/lib/api-client.ts";
import { rootKeys } from "@/lib/query-keys.ts";

export type InStudioParams = { page?: number; pageSize?: number };
export type ReceiptListParams = { direction?: "in" | "out"; kind?: CustodyKind; from?: string; to?: string; page?: number; pageSize?: number };

export const custodyKeys = {
  all: rootKeys.custody,
  object: (objectId: string) => [...rootKeys.custody, "object", objectId] as const,
  inStudio: (params: InStudioParams) => [...rootKeys.custody, "in-studio", params] as const,
  receipts: (params: ReceiptListParams) => [...rootKeys.custody, "receipts", params] as const,
};

const objectPath = (objectId: string) => `/api/objects/${encodeURIComponent(objectId)}/custody`;

export const objectCustodyQuery = (objectId: string) =>
  queryOptions({
    queryKey: custodyKeys.object(objectId),
    queryFn: () => api.get<{ items: CustodyReceipt[] }>(objectPath(objectId)).then((r) => r.items),
  });

export const inStudioQuery = (params: InStudioParams) =>
  queryOptions({
    queryKey: custodyKeys.inStudio(params),
    queryFn: () => api.get<Page<InStudioItem>>(`/api/custody/in-studio${qs(params)}`),
    placeholderData: keepPreviousData,
  });

export const custodyReceiptsQuery = (params: ReceiptListParams) =>
  queryOptions({
    queryKey: custodyKeys.receipts(params),
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
      qc.invalidateQueries({ queryKey: custodyKeys.all });
      qc.invalidateQueries({ queryKey: rootKeys.objects });
      qc.invalidateQueries({ queryKey: rootKeys.history });
    },
  });
}
