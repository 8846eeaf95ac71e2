import { keepPreviousData, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { ConditionCreate, ConditionData, ConditionListQuery, ConditionReport, ConditionRevision, Term } from "@shared/schemas/condition.ts";
import type { ComparedFinding } from "@shared/domain/condition.ts";
import { api, qs } from "@/lib/api-client.ts";
import { rootKeys } from "@/lib/query-keys.ts";
import { revisionedApi, useCorrect, useCreateDraft, useLock, useUpdateDraft } from "@/lib/revisioned.ts";

type RegisterParams = Partial<Record<keyof ConditionListQuery, string | number | undefined>>;
const reports = revisionedApi<ConditionReport, ConditionRevision, ConditionCreate, ConditionData>(rootKeys.condition, {
  base: "/api/condition",
  ofObject: "condition",
  lock: "sign",
});

export const conditionKeys = {
  ...reports.keys,
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

export const objectConditionQuery = reports.objectQuery;
export const reportQuery = reports.oneQuery;

export const useObjectCondition = (objectId: string) => useQuery({ ...objectConditionQuery(objectId), enabled: !!objectId });
export const useReport = (id: string) => useQuery({ ...reportQuery(id), enabled: !!id });
export const useReportRevisions = (id: string, enabled: boolean) => useQuery({ ...reports.revisionsQuery(id), enabled });
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

export const useCreateReport = (objectId: string) => useCreateDraft(reports, objectId);
export const useUpdateReport = (id: string) => useUpdateDraft(reports, id);
export const useSignReport = (id: string) => useLock(reports, id);
export const useCorrectReport = (id: string) => useCorrect(reports, id);
export function useSaveTerm() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (t: { id?: string; list: "paper" | "photograph"; term: string; caution: string | null; active: boolean }) =>
      t.id ? api.put<Term>(`/api/condition-terms/${encodeURIComponent(t.id)}`, t) : api.post<Term>("/api/condition-terms", t),
    onSuccess: () => qc.invalidateQueries({ queryKey: conditionKeys.terms() }),
  });
}
