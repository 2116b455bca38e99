import type { QueryClient } from '@tanstack/react-query';
import { Archive } from 'lucide-react';
import { useState, type FormEvent } from 'react';
import { Link, useSearchParams, type LoaderFunctionArgs } from 'react-router';
import { Button, ButtonLink } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { EmptyState } from '../../../components/ui/empty-state';
import { Loading } from '../../../components/ui/loading';
import { Notice } from '../../../components/ui/notice';
import { archiveQuery, useArchive } from '../api/get-archive';
import { IssuanceStateBadge } from '../components/issuance-state-badge';
import { archiveQueryFrom, archiveSearchFor, pageCount } from '../utils/archive-search';
import { dayLabel, formatInstant } from '../utils/issuance-format';
import { useNow } from '../../../hooks/use-now';

export const archiveLoader =
  (queryClient: QueryClient) =>
  ({ request }: LoaderFunctionArgs) => {
    void queryClient.prefetchQuery(archiveQuery(archiveQueryFrom(new URL(request.url).searchParams)));
    return null;
  };

/** Every issuance the office has published, searchable by text and date; nothing is hidden. */
export function ArchivePage() {
  const [searchParams, setSearchParams] = useSearchParams();
  const query = archiveQueryFrom(searchParams);
  const archive = useArchive(query);
  const now = useNow();
  const [text, setText] = useState(query.q ?? '');
  const [date, setDate] = useState(query.date ?? '');

  const onSearch = (event: FormEvent) => {
    event.preventDefault();
    setSearchParams(archiveSearchFor({ q: text.trim(), date: date || undefined, page: 1 }));
  };
  const pages = pageCount(archive.data?.total ?? 0, query.pageSize);
  const filtered = Boolean(query.q || query.date);

  return (
    <div className="space-y-5">
      <header>
        <h1 className="text-2xl font-semibold tracking-tight">Outlook archive</h1>
        <p className="mt-1 max-w-prose text-sm text-ink-muted">
          Every published issuance, newest first. Superseded and withdrawn issuances stay here and say so.{' '}
          <Link to="/bulletin" className="text-accent hover:underline">
            The current outlook is on the bulletin.
          </Link>
        </p>
      </header>

      <form role="search" onSubmit={onSearch} className="flex flex-wrap items-end gap-3 rounded-lg border border-line bg-panel p-3">
        <TextField label="Search" type="search" placeholder="Number, headline or discussion" value={text} onChange={(e) => setText(e.target.value)} className="min-w-60 flex-1" />
        <TextField label="Valid on (UTC date)" type="date" value={date} onChange={(e) => setDate(e.target.value)} />
        <Button type="submit">Search</Button>
        {filtered ? (
          <ButtonLink to="/archive" variant="ghost">
            Clear
          </ButtonLink>
        ) : null}
      </form>

      {archive.isPending ? <Loading label="Loading the archive…" /> : null}
      {archive.isError ? <Notice tone="error" title="The archive could not be loaded">{archive.error.message}</Notice> : null}

      {archive.data && archive.data.issuances.length === 0 ? (
        <EmptyState icon={<Archive aria-hidden className="size-5" />} title={filtered ? 'No issuance matches' : 'Nothing has been published yet'}>
          {filtered ? 'Try other words or another date, or clear the search.' : 'Published outlooks are kept here permanently.'}
        </EmptyState>
      ) : null}

      {archive.data && archive.data.issuances.length > 0 ? (
        <section aria-label="Issuances" className="relative overflow-x-auto rounded-lg border border-line bg-panel">
          <table className="w-full text-left text-sm">
            <thead className="border-b border-line bg-sunken text-[13px] text-ink-muted">
              <tr>
                <th className="px-3 py-2 font-medium">Issuance</th>
                <th className="px-3 py-2 font-medium">Day</th>
                <th className="px-3 py-2 font-medium">State</th>
                <th className="px-3 py-2 font-medium">Headline</th>
                <th className="px-3 py-2 font-medium">Valid from (UTC)</th>
              </tr>
            </thead>
            <tbody>
              {archive.data.issuances.map((issuance) => (
                <tr key={issuance.number} className="border-b border-line last:border-0 align-top">
                  <td className="px-3 py-2 font-semibold whitespace-nowrap">
                    <Link to={`/issuances/${issuance.number}`} className="text-accent hover:underline">
                      {issuance.number}
                    </Link>
                  </td>
                  <td className="px-3 py-2 whitespace-nowrap">{dayLabel(issuance.day)}</td>
                  <td className="px-3 py-2">
                    <IssuanceStateBadge issuance={issuance} now={now} />
                    {issuance.state === 'superseded' && issuance.supersededByNumber ? (
                      <span className="block text-[12px] text-ink-muted">by {issuance.supersededByNumber}</span>
                    ) : null}
                  </td>
                  <td className="px-3 py-2">{issuance.headline || <span className="text-ink-muted">No headline</span>}</td>
                  <td className="px-3 py-2 whitespace-nowrap text-ink-muted">{formatInstant(issuance.validFrom)}</td>
                </tr>
              ))}
            </tbody>
          </table>
          <div className="flex items-center justify-between border-t border-line px-3 py-2 text-[13px] text-ink-muted">
            <span>
              {archive.data.total} issuance{archive.data.total === 1 ? '' : 's'} · page {query.page} of {pages}
            </span>
            <span className="flex gap-2">
              {query.page > 1 ? (
                <ButtonLink size="sm" variant="secondary" to={`/archive?${archiveSearchFor({ ...query, page: query.page - 1 }).toString()}`}>
                  Newer
                </ButtonLink>
              ) : null}
              {query.page < pages ? (
                <ButtonLink size="sm" variant="secondary" to={`/archive?${archiveSearchFor({ ...query, page: query.page + 1 }).toString()}`}>
                  Older
                </ButtonLink>
              ) : null}
            </span>
          </div>
        </section>
      ) : null}
    </div>
  );
}
