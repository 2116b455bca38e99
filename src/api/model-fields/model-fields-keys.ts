/** Query keys of model fields and evidence runs: resource → kind → params. */
export const modelFieldsKeys = {
  all: ['model-fields'] as const,
  runs: () => [...modelFieldsKeys.all, 'runs'] as const,
  field: (runId: string, figure: string) => [...modelFieldsKeys.all, 'field', { runId, figure }] as const,
  evidenceRuns: (outlookId: string) => [...modelFieldsKeys.all, 'evidence-runs', outlookId] as const,
};
