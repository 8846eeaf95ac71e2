import { useQuery, useQueryClient } from "@tanstack/react-query";
import type { IssuedDocument, Verification } from "@shared/schemas/documents.ts";
import { api } from "@/lib/api-client.ts";
import { objectHistoryKey, rootKeys } from "@/lib/query-keys.ts";

export const documentKeys = {
  all: rootKeys.documents,
  object: (objectId: string) => [...rootKeys.documents, "object", objectId] as const,
  list: () => [...rootKeys.documents, "all"] as const,
  labelReadiness: () => [...rootKeys.documents, "label-readiness"] as const,
  verify: (code: string) => [...rootKeys.verify, code] as const,
};

export const useObjectDocuments = (objectId: string) =>
  useQuery({
    queryKey: documentKeys.object(objectId),
    queryFn: () => api.get<{ items: IssuedDocument[] }>(`/api/objects/${encodeURIComponent(objectId)}/documents`).then((r) => r.items),
    enabled: !!objectId,
  });
export const useAllDocuments = () => useQuery({ queryKey: documentKeys.list(), queryFn: () => api.get<{ items: IssuedDocument[] }>("/api/documents").then((r) => r.items) });
export const useVerification = (code: string) =>
  useQuery({
    queryKey: documentKeys.verify(code),
    queryFn: () => api.get<Verification>(`/api/verify/${encodeURIComponent(code)}`),
    enabled: code.trim().length >= 4,
    retry: false,
  });

export function useRefreshDocuments() {
  const qc = useQueryClient();
  return (objectId?: string) => {
    qc.invalidateQueries({ queryKey: documentKeys.all });
    if (objectId) qc.invalidateQueries({ queryKey: objectHistoryKey(objectId) });
  };
}

export type LabelReadiness = { ready: boolean; publicUrl: string; problem: string | null };
/** Whether back labels' QR codes would lead anywhere: asked before a framer prints, so the screen can warn first. */
export const useLabelReadiness = (enabled: boolean) =>
  useQuery({ queryKey: documentKeys.labelReadiness(), queryFn: () => api.get<LabelReadiness>("/api/documents/labels/readiness"), enabled, staleTime: 5 * 60_000 });
