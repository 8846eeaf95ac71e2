import { useQuery, useQueryClient } from "@tanstack/react-query";
import type { IssuedDocument, Verification } from "@shared/schemas/documents.ts";
import { api } from "@/lib/api-client.ts";

export const useObjectDocuments = (objectId: string) =>
  useQuery({ queryKey: ["documents", "object", objectId], queryFn: () => api.get<{ items: IssuedDocument[] }>(`/api/objects/${encodeURIComponent(objectId)}/documents`).then((r) => r.items), enabled: !!objectId });
export const useAllDocuments = () => useQuery({ queryKey: ["documents", "all"], queryFn: () => api.get<{ items: IssuedDocument[] }>("/api/documents").then((r) => r.items) });
export const useVerification = (code: string) =>
  useQuery({ queryKey: ["verify", code], queryFn: () => api.get<Verification>(`/api/verify/${encodeURIComponent(code)}`), enabled: code.trim().length >= 4, retry: false });

export function useRefreshDocuments() {
  const qc = useQueryClient();
  return (objectId?: string) => {
    qc.invalidateQueries({ queryKey: ["documents"] });
    if (objectId) qc.invalidateQueries({ queryKey: ["history", objectId] });
  };
}
