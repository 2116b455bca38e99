import type { QueryClient } from '@tanstack/react-query';
import { clsx } from 'clsx';
import type { FeatureCollection, Point } from 'geojson';
import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { Link, useLocation, useParams, type LoaderFunctionArgs } from 'react-router';
import { Button } from '../../../components/ui/button';
import { SelectField, TextField } from '../../../components/ui/field';
import { Loading } from '../../../components/ui/loading';
import { Notice } from '../../../components/ui/notice';
import { useMe } from '../../../hooks/use-me';
import { useOffice } from '../../../hooks/use-office';
import { useTabs } from '../../../hooks/use-tabs';
import { useUnits } from '../../../hooks/use-units';
import { AreaEditorMap, type AreaShape, type EditorMode, type JudgedPoint, type MapLayersShown } from '../../../lib/map/area-editor-map';
import { soundingJudgements } from '../../../../shared/evidence/area-report';
import { JudgementLegend } from '../components/judgement-legend';
import { useLiveEvidence, type LiveEdit } from '../hooks/use-live-evidence';
import { evidenceView, judgementCounts } from '../utils/live-evidence';
import type { PointProperties } from '../../../lib/map/point-map';
import type { OfficeSettings } from '../../../../shared/contracts/office';
import type { Outlook, RiskAreaInput } from '../../../../shared/contracts/outlooks';
import { areaKm2, checkAreas } from '../../../../shared/geometry/area-checks';
import { formatNumber } from '../../../utils/units';
import { outlookQuery, useOutlook } from '../../../api/outlooks/get-outlook';
import type { AreaEvidenceReport } from '../../../../shared/contracts/outlooks';
import { useOutlookEvidence } from '../../../api/outlooks/get-outlook-evidence';
import type { EvidenceSource } from '../../../api/outlooks/outlooks-keys';
import { usePeriodSoundings } from '../api/get-period-soundings';
import { AreaImportExport } from '../components/area-import';
import { AreaInspector } from '../components/area-inspector';
import { ConflictPrompt } from '../components/conflict-prompt';
import { DiscussionEditor } from '../components/discussion-editor';
import { EvidencePanel } from '../components/evidence-panel';
import { OutlookAreasTable } from '../components/outlook-areas-table';
import { OutlookStatus } from '../components/outlook-status';
import { RevisionList } from '../components/revision-list';
import { SaveIndicator } from '../components/save-indicator';
import { ShortcutHelp } from '../components/shortcut-help';
import { WorkspaceToolbar } from '../components/workspace-toolbar';
import { useOutlookEditor } from '../hooks/use-outlook-editor';
import { applyAreaFix, type AreaFix } from '../utils/area-fixes';
import { areaTitle } from '../../../../shared/workflow/levels';
import { areaFeatures } from '../utils/area-display';
import { newArea, removeArea, toAreaGeometry, updateArea, type DraftArea } from '../utils/outlook-document';
import { authoringRoles, hasRole } from '../../../../shared/workflow/roles';
import { outlookStateLabels } from '../../../../shared/workflow/states';
import { isEditableState } from '../../../../shared/workflow/transitions';
import { isPointParameter, pointColour, pointParameters, type PointParameter } from '../utils/sounding-colours';
import { formatPeriod, fromUtcInputValue, toUtcInputValue } from '../utils/valid-period';
import { EvidenceRunPicker } from '../../../components/model-fields/evidence-run-picker';
import { FieldControls } from '../../../components/model-fields/field-controls';
import { evidenceSourceLabels } from '../../../components/model-fields/field-display';
import { FieldLegend } from '../../../components/model-fields/field-legend';
import { useFieldLayer } from '../../../components/model-fields/use-field-layer';

/** Always loads the current version: another author may have saved since this tab last looked. */
export const workspaceLoader =
  (queryClient: QueryClient) =>
  async ({ params }: LoaderFunctionArgs) => {
    const outlookId = params.outlookId ?? '';
    await queryClient.fetchQuery({ ...outlookQuery(outlookId), staleTime: 0 }).catch(() => undefined);
    return null;
  };

const parameterOptions = (Object.keys(pointParameters) as PointParameter[]).map((key) => ({ value: key, label: pointParameters[key].label }));
const sourceOptions: { value: EvidenceSource; label: string }[] = [
  { value: 'all', label: 'Observed and model' },
  { value: 'observed', label: 'Observed only' },
  { value: 'model', label: 'Model only' },
];
const isEvidenceSource = (value: string): value is EvidenceSource => value === 'all' || value === 'observed' || value === 'model';

const panelTabs = ['area', 'outlook', 'history'] as const;
type PanelTab = (typeof panelTabs)[number];
const panelTabLabels: Record<PanelTab, string> = { area: 'Selected area', outlook: 'All areas', history: 'Revisions' };

function isTyping(target: EventTarget | null): boolean {
  if (!(target instanceof HTMLElement)) return false;
  return target.isContentEditable || ['INPUT', 'TEXTAREA', 'SELECT'].includes(target.tagName);
}

function Workspace({ initial, office, mayAuthor }: { initial: Outlook; office: OfficeSettings; mayAuthor: boolean }) {
  const editable = mayAuthor && isEditableState(initial.state);
  const editor = useOutlookEditor(initial, editable);
  const { document, change } = editor;
  const readOnly = !editable;
  const units = useUnits();
  const fieldLayer = useFieldLayer();
  const location = useLocation();
  const justCreated = location.state === 'created';
  const [mode, setMode] = useState<EditorMode>('select');
  const [selectedId, setSelectedId] = useState<string | null>(null);
  const [layers, setLayers] = useState<MapLayersShown>({ counties: true, soundings: true, areas: true });
  const [parameter, setParameter] = useState<PointParameter>('mlCape');
  const [source, setSource] = useState<EvidenceSource>('all');
  const [tab, setTab] = useState<PanelTab>('area');
  const [helpOpen, setHelpOpen] = useState(false);
  const { tabProps, panelProps } = useTabs(panelTabs, tab, setTab);
  const mapArea = useRef<HTMLDivElement>(null);
  const ladder = office.riskLadder;
  const ladderKeys = useMemo(() => ladder.map((l) => l.key), [ladder]);

  const selected = document.areas.find((a) => a.id === selectedId) ?? null;
  const checks = useMemo(() => checkAreas(document.areas, ladderKeys, office.region), [document.areas, ladderKeys, office.region]);
  const evidence = useOutlookEvidence(initial.id, source);
  const reports = useMemo(() => new Map<string, AreaEvidenceReport>((evidence.data?.areas ?? []).map((r) => [r.areaId, r])), [evidence.data]);
  const soundings = usePeriodSoundings(document.validFrom, document.validUntil);
  // Live preview: the selected area's evidence and support check recomputed in the browser as a
  // vertex moves, until the server's answer for the saved draft replaces it.
  const [live, setLive] = useState<LiveEdit | null>(null);
  const liveEvidence = useLiveEvidence({
    outlookId: initial.id,
    savedPeriod: { validFrom: editor.server.validFrom, validUntil: editor.server.validUntil },
    period: { validFrom: document.validFrom, validUntil: document.validUntil },
    source,
    ladder,
    guidance: office.guidance,
    area: selected,
    live,
  });
  const view = evidenceView({
    record: selected ? reports.get(selected.id) : undefined,
    live: liveEvidence.report,
    pending: editor.dirty || evidence.isFetching || (live !== null && live.areaId === selected?.id),
  });
  const shownReport = view.kind === 'none' ? undefined : view.report;
  const judgements = shownReport ? soundingJudgements(shownReport) : null;
  const judged: JudgedPoint[] = judgements
    ? [...judgements].flatMap(([id, kind]) => {
        const position = liveEvidence.positions.get(id);
        return position ? [{ id, longitude: position.longitude, latitude: position.latitude, kind }] : [];
      })
    : [];
  const stations = useMemo(() => new Map((soundings.data?.soundings ?? []).map((s) => [s.id, s.stationId])), [soundings.data]);
  const features = useMemo(() => areaFeatures(document.areas, ladder), [document.areas, ladder]);
  const points = useMemo<FeatureCollection<Point, PointProperties>>(
    () => ({
      type: 'FeatureCollection',
      features: (soundings.data?.soundings ?? []).flatMap((s) => {
        const value = s.figures[parameter];
        if (s.longitude === null || s.latitude === null) return [];
        return {
          type: 'Feature' as const,
          geometry: { type: 'Point' as const, coordinates: [s.longitude, s.latitude] },
          properties: { id: s.id, colour: pointColour(parameter, s.figures), label: `${s.stationId} (${s.source}): ${pointParameters[parameter].label} ${value === null ? '—' : formatNumber(value, parameter === 'stp' ? 1 : 0)}` },
        };
      }),
    }),
    [soundings.data, parameter],
  );

  const editArea = useCallback(
    (areaId: string, edit: Partial<Omit<DraftArea, 'id'>>, group?: string) => change(updateArea(document, areaId, edit), group),
    [change, document],
  );
  const deleteSelected = useCallback(() => {
    if (readOnly || selectedId === null) return;
    change(removeArea(document, selectedId));
    setSelectedId(null);
    setMode('select');
  }, [readOnly, selectedId, change, document]);

  const onCreate = useCallback(
    (geometry: AreaShape) => {
      const area = newArea(toAreaGeometry(geometry), ladder[0]?.key ?? 'thunder');
      change({ ...document, areas: [...document.areas, area] });
      setSelectedId(area.id);
      setTab('area');
    },
    [change, document, ladder],
  );
  const onGeometry = useCallback(
    (areaId: string, geometry: AreaShape) => {
      setLive(null);
      change(updateArea(document, areaId, { geometry: toAreaGeometry(geometry) }));
    },
    [change, document],
  );
  const onLiveChange = useCallback((areaId: string, geometry: AreaShape | null) => setLive(geometry ? { areaId, geometry } : null), []);
  const onFix = (areaId: string, fix: AreaFix) => change(applyAreaFix(document, areaId, fix, ladderKeys, office.region));
  const onImported = (areas: RiskAreaInput[]) => change({ ...document, areas: [...document.areas, ...areas.map((a) => ({ id: crypto.randomUUID(), levelKey: a.levelKey, hazards: a.hazards, geometry: a.geometry, label: a.label }))] });

  // Keyboard shortcuts. Those with Ctrl (or ⌘) work anywhere on the page; single keys act only
  // while focus is in the map, so they never fire while someone types or reads elsewhere
  // (WCAG 2.1.4), and never while typing in a field.
  useEffect(() => {
    const onPageKey = (event: KeyboardEvent) => {
      const ctrl = event.ctrlKey || event.metaKey;
      if (!ctrl) return;
      if (event.key.toLowerCase() === 's') {
        event.preventDefault();
        if (editable) editor.saveNow();
        return;
      }
      if (isTyping(event.target)) return;
      if (event.key.toLowerCase() === 'z') {
        event.preventDefault();
        if (readOnly) return;
        if (event.shiftKey) editor.redo();
        else editor.undo();
        return;
      }
      if (event.key.toLowerCase() === 'y') {
        event.preventDefault();
        if (!readOnly) editor.redo();
      }
    };
    const onMapKey = (event: KeyboardEvent) => {
      if (event.ctrlKey || event.metaKey || event.altKey || isTyping(event.target)) return;
      switch (event.key) {
        case 'Escape':
        case 'v':
          setMode('select');
          setHelpOpen(false);
          return;
        case '?':
          setHelpOpen((open) => !open);
          return;
      }
      if (readOnly) return;
      const key = event.key.toLowerCase();
      if (key === 'n') setMode((m) => (m === 'draw' ? 'select' : 'draw'));
      else if (selectedId !== null && key === 'e') setMode((m) => (m === 'edit' ? 'select' : 'edit'));
      else if (selectedId !== null && key === 'm') setMode((m) => (m === 'move' ? 'select' : 'move'));
      else if (selectedId !== null && key === 'h') setMode((m) => (m === 'cut' ? 'select' : 'cut'));
      else if (event.key === 'Delete' || event.key === 'Backspace') deleteSelected();
      else if (selectedId !== null && /^[1-9]$/.test(event.key)) {
        const level = ladder[Number(event.key) - 1];
        if (level) editArea(selectedId, { levelKey: level.key });
      }
    };
    const map = mapArea.current;
    window.addEventListener('keydown', onPageKey);
    map?.addEventListener('keydown', onMapKey);
    return () => {
      window.removeEventListener('keydown', onPageKey);
      map?.removeEventListener('keydown', onMapKey);
    };
  }, [editor, editable, readOnly, selectedId, deleteSelected, ladder, editArea]);

  const validFromInput = toUtcInputValue(document.validFrom);
  const validUntilInput = toUtcInputValue(document.validUntil);
  const periodProblem = new Date(document.validUntil) <= new Date(document.validFrom) ? 'The valid period must end after it starts.' : undefined;

  return (
    <div className="space-y-4">
      <OutlookStatus day={editor.server.day} state={editor.server.state} validFrom={document.validFrom} validUntil={document.validUntil} timeZone={office.timeZone} />
      <header className="flex flex-wrap items-center justify-between gap-3">
        <div className="min-w-0">
          <p className="text-[12px] text-ink-muted">
            <Link to="/desk" className="hover:underline">
              Forecast desk
            </Link>{' '}
            / Day {editor.server.day} outlook · {outlookStateLabels[editor.server.state]}
          </p>
          <h1 className="truncate text-lg font-semibold tracking-tight">{document.headline.trim() || `Day ${editor.server.day} outlook (no headline yet)`}</h1>
        </div>
        <div className="flex items-center gap-3">
          <SaveIndicator phase={editor.phase} timeZone={office.timeZone} />
          {editor.phase.kind === 'error' ? (
            <Button size="sm" variant="secondary" onClick={editor.saveNow}>
              Try again
            </Button>
          ) : null}
        </div>
      </header>
      {justCreated ? (
        <Notice tone="success" title="New draft started">
          Valid {formatPeriod(document.validFrom, document.validUntil, office.timeZone)} ({formatPeriod(document.validFrom, document.validUntil, 'UTC')}), computed from the office time zone. Change it under “Valid period” below the
          map.
        </Notice>
      ) : null}
      {editor.phase.kind === 'conflict' ? <ConflictPrompt message={editor.phase.message} onReload={editor.reload} onKeepMine={editor.keepMine} /> : null}
      {editor.phase.kind === 'error' ? <Notice tone="error" title="The draft was not saved">{editor.phase.message}</Notice> : null}
      {readOnly ? (
        <Notice tone="info" title="Read only">
          {mayAuthor ? `This outlook is ${outlookStateLabels[editor.server.state].toLowerCase()}; only drafts are edited here.` : 'Your role reads outlooks; forecasters and leads edit them.'}
        </Notice>
      ) : null}

      <WorkspaceToolbar
        mode={mode}
        hasSelection={selected !== null}
        readOnly={readOnly}
        canUndo={editor.canUndo}
        canRedo={editor.canRedo}
        onMode={setMode}
        onDelete={deleteSelected}
        onUndo={editor.undo}
        onRedo={editor.redo}
        onHelp={() => setHelpOpen((open) => !open)}
      />

      <div className="grid grid-cols-[minmax(0,1fr)] items-start gap-3 xl:grid-cols-[minmax(0,1fr)_24rem]">
        <div className="space-y-2">
          <div className="relative" ref={mapArea}>
            <AreaEditorMap
              label="Outlook map"
              className="h-[calc(100dvh-16rem)] min-h-[28rem]"
              region={office.region}
              areas={features}
              selectedId={selectedId}
              points={points}
              layers={layers}
              mode={mode}
              field={fieldLayer.mapField}
              onSelect={(id) => {
                setSelectedId(id);
                if (id !== null) setTab('area');
              }}
              onCreate={onCreate}
              onChange={onGeometry}
              onLiveChange={onLiveChange}
              judged={judged}
              onModeChange={setMode}
              renderPopup={(properties) => (
                <span className="text-[13px]">
                  {properties.label}
                  <br />
                  <Link to={`/soundings/${properties.id}`}>Open the sounding</Link>
                </span>
              )}
              tileUrl={office.baseMap.tileUrl ?? undefined}
              tileAttribution={office.baseMap.attribution ?? undefined}
            />
            {mode === 'draw' ? (
              <p className="pointer-events-none absolute bottom-3 left-1/2 z-[1000] -translate-x-1/2 rounded bg-ink/85 px-3 py-1 text-[13px] text-white">
                Click to add points; click the first point to finish. Esc cancels.
              </p>
            ) : null}
            {helpOpen ? <ShortcutHelp onClose={() => setHelpOpen(false)} /> : null}
          </div>
          <div className="flex flex-wrap items-end gap-4 text-[13px]">
            <fieldset className="flex items-center gap-3">
              <legend className="sr-only">Layers</legend>
              {(
                [
                  ['counties', 'Counties'],
                  ['soundings', 'Soundings'],
                  ['areas', 'Risk areas'],
                ] as const
              ).map(([key, label]) => (
                <label key={key} className="flex items-center gap-1.5">
                  <input type="checkbox" checked={layers[key]} onChange={(event) => setLayers((l) => ({ ...l, [key]: event.target.checked }))} />
                  {label}
                </label>
              ))}
            </fieldset>
            <SelectField
              label="Colour soundings by"
              className="w-52"
              value={parameter}
              options={parameterOptions}
              onChange={(event) => {
                if (isPointParameter(event.target.value)) setParameter(event.target.value);
              }}
            />
            {judgements ? <JudgementLegend counts={judgementCounts(judgements)} preview={view.kind === 'preview'} /> : null}
            <FieldControls layer={fieldLayer} />
            <p className="pb-2 text-ink-muted">
              {soundings.data ? `${soundings.data.soundings.length} soundings valid in the period` : soundings.isError ? 'Soundings could not be loaded.' : 'Loading soundings…'}
            </p>
          </div>
          {fieldLayer.field ? <FieldLegend field={fieldLayer.field} units={units.units} /> : null}
          {fieldLayer.error ? <p className="text-[13px] text-danger">The model field could not be drawn: {fieldLayer.error.message}</p> : null}
        </div>

        <aside aria-label="Evidence panel" className="rounded-lg border border-line bg-panel">
          <div role="tablist" aria-label="Panel" className="flex border-b border-line text-[13px]">
            {panelTabs.map((key) => (
              <button key={key} {...tabProps(key)} className={clsx('flex-1 px-3 py-2 font-medium', tab === key ? 'border-b-2 border-accent text-ink' : 'text-ink-muted hover:text-ink')}>
                {panelTabLabels[key]}
              </button>
            ))}
          </div>
          <div {...panelProps} className="max-h-[calc(100dvh-14rem)] space-y-4 overflow-y-auto p-3">
            {tab === 'area' ? (
              selected ? (
                <>
                  <h2 className="text-sm font-semibold">{areaTitle(ladder, selected)}</h2>
                  <AreaInspector
                    area={selected}
                    ladder={ladder}
                    checks={checks[selected.id] ?? []}
                    sizeKm2={safeArea(selected)}
                    readOnly={readOnly}
                    onChange={(edit, group) => editArea(selected.id, edit, group)}
                    onFix={(fix) => onFix(selected.id, fix)}
                    onDelete={deleteSelected}
                  />
                  <section aria-label="Evidence" className="border-t border-line pt-3">
                    <div className="mb-2 flex items-end justify-between gap-2">
                      <h2 className="text-sm font-semibold">Evidence</h2>
                      <SelectField label="Source" hideLabel className="w-44" value={source} options={sourceOptions} onChange={(event) => isEvidenceSource(event.target.value) && setSource(event.target.value)} />
                    </div>
                    <EvidencePanel report={shownReport} stale={view.kind === 'stale'} preview={view.kind === 'preview'} units={units} stationOf={(id) => stations.get(id) ?? liveEvidence.positions.get(id)?.stationId ?? 'Sounding'} sources={evidenceSourceLabels(evidence.data, selected.id)} />
                  </section>
                </>
              ) : (
                <p className="text-[13px] text-ink-muted">Select an area on the map (or in “All areas”) to set its level and hazards and to see its evidence. Draw a new one with “Draw area” (N).</p>
              )
            ) : null}
            {tab === 'outlook' ? (
              <>
                <div className="flex items-end justify-between gap-2">
                  <p className="text-[13px] text-ink-muted">{evidence.data ? `${evidence.data.soundingCount} soundings valid in the period` : 'Loading evidence…'}</p>
                  <SelectField label="Source" hideLabel className="w-44" value={source} options={sourceOptions} onChange={(event) => isEvidenceSource(event.target.value) && setSource(event.target.value)} />
                </div>
                <OutlookAreasTable
                  areas={document.areas}
                  ladder={ladder}
                  reports={reports}
                  selectedId={selectedId}
                  onSelect={(id) => {
                    setSelectedId(id);
                    setTab('area');
                  }}
                />
                <AreaImportExport outlookId={initial.id} readOnly={readOnly} onImported={onImported} />
                <EvidenceRunPicker outlookId={initial.id} editable={editable} />
              </>
            ) : null}
            {tab === 'history' ? <RevisionList outlookId={initial.id} /> : null}
          </div>
        </aside>
      </div>

      <section aria-label="Discussion and valid period" className="grid gap-4 rounded-lg border border-line bg-panel p-4 xl:grid-cols-[minmax(0,1fr)_18rem]">
        <DiscussionEditor
          headline={document.headline}
          discussion={document.discussion}
          hazardNotes={document.hazardNotes}
          readOnly={readOnly}
          onHeadline={(headline) => change({ ...document, headline }, 'headline')}
          onDiscussion={(discussion) => change({ ...document, discussion }, 'discussion')}
          onHazardNote={(hazard, note) => change({ ...document, hazardNotes: { ...document.hazardNotes, [hazard]: note } }, `note-${hazard}`)}
        />
        <fieldset className="space-y-3">
          <legend className="mb-1 text-[13px] font-semibold">Valid period (UTC)</legend>
          <TextField
            label="Valid from (UTC)"
            type="datetime-local"
            value={validFromInput}
            disabled={readOnly}
            onChange={(event) => {
              const iso = fromUtcInputValue(event.target.value);
              if (iso) change({ ...document, validFrom: iso }, 'validFrom');
            }}
          />
          <TextField
            label="Valid until (UTC)"
            type="datetime-local"
            value={validUntilInput}
            disabled={readOnly}
            error={periodProblem}
            onChange={(event) => {
              const iso = fromUtcInputValue(event.target.value);
              if (iso) change({ ...document, validUntil: iso }, 'validUntil');
            }}
          />
          <p className="text-[12px] text-ink-muted">Office local: {formatPeriod(document.validFrom, document.validUntil, office.timeZone)}</p>
        </fieldset>
      </section>
    </div>
  );
}

function safeArea(area: DraftArea): number | null {
  try {
    return areaKm2(area.geometry);
  } catch {
    return null;
  }
}

/** `/outlooks/:outlookId`: the authoring workspace. */
export function OutlookWorkspacePage() {
  const { outlookId = '' } = useParams();
  const outlook = useOutlook(outlookId);
  const office = useOffice();
  const me = useMe();
  if (outlook.isError || office.isError) {
    return (
      <Notice tone="error" title="We could not open this outlook">
        {(outlook.error ?? office.error)?.message}
      </Notice>
    );
  }
  if (!outlook.data || !office.data || me.isPending) return <Loading label="Opening the outlook…" />;
  return <Workspace key={outlook.data.id} initial={outlook.data} office={office.data} mayAuthor={me.data ? hasRole(me.data.user.role, authoringRoles) : false} />;
}
