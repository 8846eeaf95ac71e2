import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { ConditionCreate, ConditionData, ConditionListQuery, ConditionReport, ConditionRevision, Term } from "@shared/schemas/condition.ts";
import type { ComparedFinding } from "@shared/domain/condition.ts";
import type { Change } from "@shared/domain/diff.ts";
import { api, qs } from "@/lib/api-client.ts";
import { objectHistoryKey, rootKeys } from "@/lib/query-keys.ts";

type RegisterParams = Partial<Record<keyof ConditionListQuery, string | number | undefined>>;
export const conditionKeys = {
  all: rootKeys.condition,
  object: (objectId: string) => [...rootKeys.condition, "object", objectId] as const,
  one: (id: string) => [...rootKeys.condition, "one", id] as const,
  revisions: (id: string) => [...rootKeys.condition, "revisions", id] as const,
  compare: (from: string, to: string) => [...rootKeys.condition, "compare", from, to] as const,
  register: (params: RegisterParams) => [...rootKeys.condition, "register", params] as const,
  terms: (all?: boolean) => (all === undefined ? rootKeys.conditionTerms : ([...rootKeys.conditionTerms, all] as const)),
};

export type ConditionRegisterItem = {
  id: string;
  objectId: string;
  objectNumber: string;
  objectTitle: string;
  reportDate: string;
  context: ConditionReport["context"];
  rating: ConditionReport["rating"];
  status: ConditionReport["status"];
  examinerName: string;
  unresolvedCount: number;
  checkDueOn: string | null;
};

export const objectConditionQuery = (objectId: string) =>
  queryOptions({
    queryKey: conditionKeys.object(objectId),
    queryFn: () => api.get<{ items: ConditionReport[] }>(`/api/objects/${encodeURIComponent(objectId)}/condition`).then((r) => r.items),
  });
export const reportQuery = (id: string) => queryOptions({ queryKey: conditionKeys.one(id), queryFn: () => api.get<ConditionReport>(`/api/condition/${encodeURIComponent(id)}`) });

export const useObjectCondition = (objectId: string) => useQuery({ ...objectConditionQuery(objectId), enabled: !!objectId });
export const useReport = (id: string) => useQuery({ ...reportQuery(id), enabled: !!id });
export const useReportRevisions = (id: string, enabled: boolean) =>
  useQuery({
    queryKey: conditionKeys.revisions(id),
    queryFn: () => api.get<{ items: (ConditionRevision & { changes: Change[] })[] }>(`/api/condition/${encodeURIComponent(id)}/revisions`).then((r) => r.items),
    enabled,
  });
export const useComparison = (from: string, to: string) =>
  useQuery({
    queryKey: conditionKeys.compare(from, to),
    queryFn: () => api.get<{ earlier: ConditionReport; later: ConditionReport; findings: ComparedFinding[] }>(`/api/condition/compare${qs({ from, to })}`),
    enabled: !!from && !!to && from !== to,
  });
export const useConditionRegister = (params: RegisterParams) =>
  useQuery({
    queryKey: conditionKeys.register(params),
    queryFn: () =>
      api.get<{ items: ConditionRegisterItem[]; total: number; page: number; pageSize: number; examiners: { id: string; name: string }[] }>(
        `/api/condition${qs(params as Record<string, string | number | undefined>)}`,
      ),
    placeholderData: keepPreviousData,
  });
export const useTerms = (all = false) =>
  useQuery({
    queryKey: conditionKeys.terms(all),
    queryFn: () => api.get<{ items: Term[] }>(`/api/condition-terms${qs({ all: all ? "true" : undefined })}`).then((r) => r.items),
    staleTime: 5 * 60_000,
  });

function useDone() {
  const qc = useQueryClient();
  return (r: ConditionReport) => {
    qc.setQueryData(reportQuery(r.id).queryKey, r);
    qc.invalidateQueries({ queryKey: conditionKeys.all });
    qc.invalidateQueries({ queryKey: objectHistoryKey(r.objectId) });
    qc.invalidateQueries({ queryKey: rootKeys.objects });
  };
}
export function useCreateReport(objectId: string) {
  const done = useDone();
  return useMutation({ mutationFn: (b: ConditionCreate) => api.post<ConditionReport>(`/api/objects/${encodeURIComponent(objectId)}/condition`, b), onSuccess: done });
}
export function useUpdateReport(id: string) {
  const done = useDone();
  return useMutation({ mutationFn: (b: ConditionCreate & { version: number }) => api.put<ConditionReport>(`/api/condition/${encodeURIComponent(id)}`, b), onSuccess: done });
}
export function useSignReport(id: string) {
  const done = useDone();
  return useMutation({ mutationFn: (version: number) => api.post<ConditionReport>(`/api/condition/${encodeURIComponent(id)}/sign`, { version }), onSuccess: done });
}
export function useCorrectReport(id: string) {
  const done = useDone();
  return useMutation({
    mutationFn: (b: { version: number; correctionReason: string; data: ConditionData }) => api.post<ConditionReport>(`/api/condition/${encodeURIComponent(id)}/corrections`, b),
    onSuccess: done,
  });
}
export function useSaveTerm() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (t: { id?: string; list: "paper" | "photograph"; term: string; caution: string | null; active: boolean }) =>
      t.id ? api.put<Term>(`/api/condition-terms/${encodeURIComponent(t.id)}`, t) : api.post<Term>("/api/condition-terms", t),
    onSuccess: () => qc.invalidateQueries({ queryKey: conditionKeys.terms() }),
  });
}
