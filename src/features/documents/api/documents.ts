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

export type LabelReadiness = { ready: boolean; publicUrl: string; problem: string | null };
/** Whether back labels' QR codes would lead anywhere: asked before a framer prints, so the screen can warn first. */
export const useLabelReadiness = (enabled: boolean) =>
  useQuery({ queryKey: ["documents", "label-readiness"], queryFn: () => api.get<LabelReadiness>("/api/documents/labels/readiness"), enabled, staleTime: 5 * 60_000 });
