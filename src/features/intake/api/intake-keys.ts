/** Query keys of the intake feature: resource → kind → params. Writes invalidate `all`. */
export const intakeKeys = {
  all: ['intake'] as const,
  files: () => [...intakeKeys.all, 'files'] as const,
  status: () => [...intakeKeys.all, 'status'] as const,
  sources: () => [...intakeKeys.all, 'sources'] as const,
};
