import type { QueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { Loading } from '../../../components/ui/loading';
import { Notice } from '../../../components/ui/notice';
import { PageHeader } from '../../../components/ui/page-header';
import { officeQueryOptions, useOffice } from '../../../hooks/use-office';
import { OfficeSettingsForm } from '../components/office-settings-form';

export const officeSettingsLoader = (queryClient: QueryClient) => () => queryClient.prefetchQuery(officeQueryOptions());

export function OfficeSettingsPage() {
  const office = useOffice();
  const [generation, setGeneration] = useState(0);
  const [lastReset, setLastReset] = useState<'saved' | 'reloaded' | null>(null);

  return (
    <>
      <PageHeader title="Office settings" description="Name, region, time zone, the risk ladder every outlook of this office uses, and the guidance the support check applies." />
      {lastReset === 'saved' ? (
        <Notice tone="success" className="mb-4">
          Settings saved. Every page now uses them.
        </Notice>
      ) : null}
      {lastReset === 'reloaded' ? (
        <Notice tone="info" className="mb-4">
          Showing the latest saved settings.
        </Notice>
      ) : null}
      {office.isPending ? <Loading label="Loading settings…" /> : null}
      {office.isError ? (
        <Notice tone="error" title="We could not load the office settings">
          {office.error.message}
        </Notice>
      ) : null}
      {office.data ? (
        <div className="max-w-5xl">
          <OfficeSettingsForm
            key={generation}
            office={office.data}
            onReset={(reason) => {
              setLastReset(reason);
              setGeneration((g) => g + 1);
            }}
          />
        </div>
      ) : null}
    </>
  );
}
