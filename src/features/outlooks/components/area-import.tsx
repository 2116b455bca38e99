import { Download, Upload } from 'lucide-react';
import { useId, useState } from 'react';
import { buttonClasses } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { isApiError } from '../../../lib/api-client';
import type { RiskAreaInput } from '../../../../shared/contracts/outlooks';
import { useImportAreas } from '../../../api/outlooks/import-areas';

/** GeoJSON out (the saved areas, RFC 7946) and in (a file → the server checks it → areas added to the draft). */
export function AreaImportExport({ outlookId, readOnly, onImported }: { outlookId: string; readOnly: boolean; onImported: (areas: RiskAreaInput[]) => void }) {
  const id = useId();
  const importAreas = useImportAreas();
  const [problems, setProblems] = useState<{ title: string; lines: string[] } | null>(null);
  const [done, setDone] = useState<string | null>(null);

  const readFile = async (file: File) => {
    setProblems(null);
    setDone(null);
    let document: unknown;
    try {
      document = JSON.parse(await file.text());
    } catch {
      setProblems({ title: `${file.name} is not valid JSON`, lines: ['Export the areas as GeoJSON (RFC 7946) and choose that file.'] });
      return;
    }
    importAreas.mutate(document, {
      onSuccess: (result) => {
        onImported(result.areas);
        setDone(`${result.areas.length} ${result.areas.length === 1 ? 'area' : 'areas'} added from ${file.name}.`);
      },
      onError: (error) => {
        setProblems({ title: `${file.name} could not be imported`, lines: isApiError(error) && error.issues.length > 0 ? error.issues.map((issue) => issue.message) : [error.message] });
      },
    });
  };

  return (
    <div className="space-y-2">
      <div className="flex flex-wrap gap-2">
        <a href={`/api/outlooks/${outlookId}/geojson`} download className={buttonClasses('secondary', 'sm')}>
          <Download aria-hidden className="size-4" /> Download GeoJSON
        </a>
        {!readOnly ? (
          <label htmlFor={`${id}-file`} className={buttonClasses('secondary', 'sm', 'cursor-pointer')}>
            <Upload aria-hidden className="size-4" /> Import GeoJSON
            <input
              id={`${id}-file`}
              type="file"
              accept=".geojson,.json,application/geo+json,application/json"
              className="sr-only"
              onChange={(event) => {
                const file = event.target.files?.[0];
                event.target.value = '';
                if (file) void readFile(file);
              }}
            />
          </label>
        ) : null}
      </div>
      <p className="text-[12px] text-ink-faint">The download holds the last saved areas. Imported features need a Polygon or MultiPolygon and a “level” property (a ladder key or label).</p>
      {done ? <Notice tone="success">{done}</Notice> : null}
      {problems ? (
        <Notice tone="error" title={problems.title}>
          <ul aria-label="Import problems" className="list-disc pl-4">
            {problems.lines.map((line) => (
              <li key={line}>{line}</li>
            ))}
          </ul>
        </Notice>
      ) : null}
    </div>
  );
}
