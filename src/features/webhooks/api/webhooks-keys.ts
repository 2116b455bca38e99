/** Query keys of the webhooks feature: resource → kind → params. Writes invalidate `all`. */
export const webhooksKeys = {
  all: ['webhook-endpoints'] as const,
  list: () => [...webhooksKeys.all, 'list'] as const,
  deliveries: (endpointId: string) => [...webhooksKeys.all, 'deliveries', { endpointId }] as const,
};
