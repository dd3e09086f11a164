/**
 * Plan & profile: the map over the project's own base map, the profile strip of the chosen bore
 * beneath it, and the table of lines against that bore — one selection shared by all three —
 * with live editing of the bore's profile and casing and a printable sheet.
 */
import { lazy, Suspense, useEffect, useMemo, useState } from 'react';
import { LINE_KINDS, LINE_KIND_LABELS, UNIT_LABELS } from '@shared/domain';
import type { BoreDto, ClearanceRuleDto, ClearancesDto, HoleDto, LineDto, PitDto, ProjectDto, TilesetDto } from '@shared/api';
import type { BoreUpdateInput } from '@shared/schemas/bore';
import { formatStation, type BoreReport } from '@shared/geometry';
import { UNIT_SYMBOLS } from '@shared/units';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/field';
import { EmptyState, Loading } from '@/components/ui/states';
import { formatDateTime, formatNumber } from '@/lib/format';
import { projectFrame } from '../lib/geo';
import { liveBoreReport, prepareLiveScene } from '../lib/live';
import { createSelectionStore, SelectionContext, useSelection } from '../lib/selection';
import { STATUS_COLOURS, STATUS_LABELS } from '../lib/styles';
import { BasemapPanel } from './basemap-admin';
import { BoreEditor } from './bore-editor';
import { ClearanceTable } from './clearance-table';
import { LayerToggles, Legend } from './legend';
import type { LayerState } from './plan-map';
import { PrintFooter, PrintHeader, usePrintMode } from './print-sheet';
import { EXAGGERATIONS, ProfileStrip, type Exaggeration } from './profile-strip';

const PlanMap = lazy(() => import('./plan-map'));

export interface PlanProfileProps {
  project: ProjectDto;
  bores: readonly BoreDto[];
  pits: readonly PitDto[];
  lines: readonly LineDto[];
  holes: readonly HoleDto[];
  rules: readonly ClearanceRuleDto[];
  clearances: ClearancesDto;
  tileset: TilesetDto | null;
  canEditBores: boolean;
  canUploadTiles: boolean;
  /** Save through the API; resolves once the caches that depend on the bore are fresh. */
  saveBore: (boreId: number, input: BoreUpdateInput) => Promise<BoreDto>;
  /** The bore a 409 carried, or null for any other error. */
  staleBoreOf: (error: unknown) => BoreDto | null;
  /** Bore to show first (e.g. from the Bores tab), and whether to open it for editing. */
  initialBoreId?: number | null;
  startEditing?: boolean;
}

interface Editing {
  draft: BoreDto;
  /** Version the save is based on (the one opened, or theirs after "keep mine"). */
  version: number;
  theirs: BoreDto | null;
  error: unknown;
  saving: boolean;
}

const DEFAULT_LAYERS: LayerState = { basemap: true, lines: true, holes: true, suggested: true, conflicts: true, bores: true, stations: true };

export function PlanProfile(props: PlanProfileProps) {
  const [store] = useState(() => createSelectionStore());
  return (
    <SelectionContext.Provider value={store}>
      <PlanProfileView {...props} />
    </SelectionContext.Provider>
  );
}

function PlanProfileView(props: PlanProfileProps) {
  const { project, bores, pits, lines, holes, rules, clearances, tileset } = props;
  const frame = useMemo(() => projectFrame(project), [project]);
  const [boreId, setBoreId] = useState<number | null>(() => bores.find((b) => b.id === props.initialBoreId)?.id ?? bores[0]?.id ?? null);
  const [layers, setLayers] = useState<LayerState>(DEFAULT_LAYERS);
  const [exaggeration, setExaggeration] = useState<Exaggeration>('auto');
  const [editing, setEditing] = useState<Editing | null>(() => {
    const b = bores.find((x) => x.id === props.initialBoreId);
    return props.startEditing && props.canEditBores && b ? { draft: structuredClone(b), version: b.version, theirs: null, error: null, saving: false } : null;
  });
  usePrintMode();

  const savedBore = bores.find((b) => b.id === boreId) ?? bores[0] ?? null;
  useEffect(() => {
    if (savedBore && savedBore.id !== boreId) setBoreId(savedBore.id);
  }, [savedBore, boreId]);

  const isEditing = editing !== null;
  const live = useMemo(
    () => (isEditing ? prepareLiveScene({ unit: project.unit, settings: project.settings, rules, lines, holes }) : null),
    [isEditing, project.unit, project.settings, rules, lines, holes],
  );
  const borePits = useMemo(() => pits.filter((p) => p.boreId === savedBore?.id), [pits, savedBore]);
  const liveReport = useMemo(() => (editing && live ? liveBoreReport(live, editing.draft, borePits) : null), [editing, live, borePits]);
  const baseReports = clearances.report.bores;
  const baseReport = baseReports.find((r) => r.boreId === savedBore?.id) ?? null;
  const reports: BoreReport[] = useMemo(
    () => (liveReport ? baseReports.map((r) => (r.boreId === liveReport.boreId ? liveReport : r)) : baseReports),
    [baseReports, liveReport],
  );
  const report = liveReport ?? baseReport;
  const shownBore = editing?.draft ?? savedBore;
  const lineMap = useMemo(() => new Map(lines.map((l) => [l.id, l])), [lines]);
  const kinds = useMemo(() => LINE_KINDS.filter((k) => lines.some((l) => l.kind === k)), [lines]);
  const u = UNIT_SYMBOLS[project.unit];

  const startEditing = () => savedBore && setEditing({ draft: structuredClone(savedBore), version: savedBore.version, theirs: null, error: null, saving: false });
  const cancel = () => setEditing(null);
  const save = async () => {
    if (!editing) return;
    setEditing({ ...editing, saving: true, error: null });
    try {
      await props.saveBore(editing.draft.id, { profile: editing.draft.profile, casingOd: editing.draft.casingOd, version: editing.version });
      setEditing(null);
    } catch (error) {
      const theirs = props.staleBoreOf(error);
      setEditing((e) => (e ? { ...e, saving: false, theirs, error: theirs ? null : error } : e));
    }
  };

  const noData = bores.length === 0 && lines.length === 0;

  return (
    <div className="space-y-4">
      <PrintHeader project={project} bore={shownBore} checkedAt={clearances.checkedAt} />
      <div className="flex flex-wrap items-end justify-between gap-3 print:hidden">
        <div className="flex flex-wrap items-end gap-3">
          <h2 className="text-lg font-semibold">Plan &amp; profile</h2>
          {bores.length > 1 && (
            <SelectField label="Bore" value={savedBore?.id ?? ''} disabled={isEditing} onChange={(e) => setBoreId(Number(e.target.value))} wrapperClassName="min-w-56">
              {bores.map((b) => (
                <option key={b.id} value={b.id}>
                  {b.name}
                </option>
              ))}
            </SelectField>
          )}
          {bores.length === 1 && savedBore && <p className="pb-0.5 text-sm text-ink-600">{savedBore.name}</p>}
        </div>
        <div className="flex flex-wrap items-end gap-2">
          <SelectField
            label="Vertical exaggeration"
            value={String(exaggeration)}
            onChange={(e) => setExaggeration(e.target.value === 'auto' ? 'auto' : (Number(e.target.value) as Exaggeration))}
            wrapperClassName="w-44"
          >
            {EXAGGERATIONS.map((v) => (
              <option key={String(v)} value={String(v)}>
                {v === 'auto' ? 'Fit to the strip' : `${v}×`}
              </option>
            ))}
          </SelectField>
          {props.canEditBores && savedBore && !isEditing && (
            <Button variant="secondary" onClick={startEditing}>
              Edit bore profile
            </Button>
          )}
          <Button variant="secondary" onClick={() => window.print()}>
            Print sheet
          </Button>
        </div>
      </div>

      {noData ? (
        <EmptyState title="Nothing to draw yet">
          <p>
            Plan &amp; profile draws the project’s bores, pits, lines and test holes on a map, with the chosen bore in section beneath. Enter a bore or
            lines first; positions are in {project.crsCode}, {UNIT_LABELS[project.unit]}.
          </p>
        </EmptyState>
      ) : (
        <div className="grid grid-cols-[minmax(0,1fr)] gap-4 lg:grid-cols-[minmax(0,1fr)_18rem] print:block">
          <div className="min-w-0 space-y-3">
            <Suspense fallback={<Loading label="Loading the map…" className="h-[360px] justify-center rounded-lg border border-ink-200 bg-white sm:h-[460px]" />}>
              <PlanMap
                projectId={project.id}
                frame={frame}
                stationStyle={project.stationStyle}
                lines={lines}
                bores={bores}
                pits={pits}
                holes={holes}
                reports={reports}
                activeBoreId={savedBore?.id ?? null}
                tileset={tileset}
                layers={layers}
                className="relative isolate h-[360px] overflow-hidden rounded-lg border border-ink-200 bg-white sm:h-[460px] print:h-[430px]"
              />
            </Suspense>
            {shownBore && savedBore ? (
              <div className="overflow-hidden rounded-lg border border-ink-200 bg-white">
                <ProfileStrip
                  bore={shownBore}
                  baseBore={savedBore}
                  report={report}
                  lines={lineMap}
                  holes={holes}
                  pits={borePits}
                  unit={project.unit}
                  datum={project.verticalDatum}
                  stationStyle={project.stationStyle}
                  exaggeration={exaggeration}
                  editing={isEditing}
                  onMovePoint={(i, station, elevation) =>
                    setEditing((e) => (e ? { ...e, draft: { ...e.draft, profile: e.draft.profile.map((p, k) => (k === i ? { station, elevation } : p)) } } : e))
                  }
                />
                <p className="border-t border-ink-100 px-3 py-1.5 text-xs text-ink-600 print:hidden">
                  {isEditing ? (
                    <strong className="font-semibold text-sky-800">Editing: drag the blue profile points, or use the fields; figures are recomputed in this browser.</strong>
                  ) : (
                    <>Clearances checked {formatDateTime(clearances.checkedAt)}. </>
                  )}{' '}
                  Casing band white, tolerance envelope grey (±{formatNumber(shownBore.toleranceVertical, 2)} {u}), bore window green dashed; lines drawn to
                  scale at their crossing.
                </p>
              </div>
            ) : (
              <EmptyState title="No bore to draw in profile">
                <p>The profile strip shows a bore in section with every line it crosses. Enter a bore under Bores.</p>
              </EmptyState>
            )}
            {editing && savedBore && (
              <BoreEditor
                draft={editing.draft}
                saved={savedBore}
                liveReport={liveReport}
                baseReport={baseReport}
                unit={project.unit}
                datum={project.verticalDatum}
                stationStyle={project.stationStyle}
                onChange={(draft) => setEditing((e) => (e ? { ...e, draft } : e))}
                onSave={save}
                onCancel={cancel}
                saving={editing.saving}
                error={editing.error}
                theirs={editing.theirs}
                onTakeTheirs={() => setEditing(null)}
                onKeepMine={() => setEditing((e) => (e && e.theirs ? { ...e, version: e.theirs.version, theirs: null } : e))}
              />
            )}
          </div>
          <aside className="space-y-4 print:hidden" aria-label="Legend, layers and selection">
            <SelectionCard lines={lineMap} holes={holes} bores={bores} pits={pits} report={report} project={project} />
            <div className="rounded-lg border border-ink-200 bg-white p-3">
              <LayerToggles layers={layers} onChange={setLayers} basemapAvailable={Boolean(tileset?.available)} />
            </div>
            <div className="rounded-lg border border-ink-200 bg-white p-3">
              <h2 className="mb-2 text-sm font-semibold text-ink-900">Legend</h2>
              <Legend kinds={kinds} />
            </div>
            <div className="rounded-lg border border-ink-200 bg-white p-3">
              <BasemapPanel projectId={project.id} tileset={tileset} canUpload={props.canUploadTiles} />
            </div>
          </aside>
        </div>
      )}

      {savedBore && (
        <section className="space-y-2">
          <h3 className="text-base font-semibold print:text-sm">
            Lines against {savedBore.name}
            {report && (
              <span className="ml-2 text-sm font-normal text-ink-600">
                {(['overlap', 'conflict', 'marginal', 'unverified', 'clear'] as const)
                  .filter((s) => report.counts[s] > 0)
                  .map((s) => `${report.counts[s]} ${STATUS_LABELS[s].toLowerCase()}`)
                  .join(', ')}
              </span>
            )}
          </h3>
          <ClearanceTable lines={lines} report={report} baseReport={baseReport} unit={project.unit} stationStyle={project.stationStyle} editing={isEditing} />
        </section>
      )}
      <PrintFooter project={project} kinds={kinds} />
    </div>
  );
}

/** Details of whatever is selected, whichever view it was selected in. */
function SelectionCard({ lines, holes, bores, pits, report, project }: {
  lines: ReadonlyMap<number, LineDto>;
  holes: readonly HoleDto[];
  bores: readonly BoreDto[];
  pits: readonly PitDto[];
  report: BoreReport | null;
  project: ProjectDto;
}) {
  const { selected } = useSelection();
  const u = UNIT_SYMBOLS[project.unit];
  let body: React.ReactNode = <p className="text-ink-500">Select a line, test hole, bore or pit on the map, in the profile or in the table.</p>;
  if (selected?.type === 'line') {
    const line = lines.get(selected.id);
    const lc = report?.lines.find((l) => l.lineId === selected.id);
    const p = lc?.points[lc.governingPoint];
    if (line) {
      body = (
        <>
          <p className="font-semibold text-ink-900">{line.label}</p>
          <p>
            {LINE_KIND_LABELS[line.kind]}, {line.owner}; QL-{line.qualityLevel}
            {line.status !== 'active' && `, ${line.status}`}
          </p>
          {lc && p ? (
            <p>
              <span className="font-semibold" style={{ color: STATUS_COLOURS[lc.status] }}>
                {STATUS_LABELS[lc.status]}
              </span>{' '}
              at {formatStation(p.station, project.stationStyle)}: clearance {lc.clearance == null ? '—' : `${formatNumber(lc.clearance, 2)} ${u}`}, required{' '}
              {formatNumber(lc.required, 2)} {u}
              {lc.margin != null && `, margin ${formatNumber(lc.margin, 2)} ${u}`}.
            </p>
          ) : (
            <p className="text-ink-500">Not near the chosen bore.</p>
          )}
        </>
      );
    }
  } else if (selected?.type === 'hole') {
    const hole = holes.find((h) => h.id === selected.id);
    if (hole) {
      body = (
        <>
          <p className="font-semibold text-ink-900">Test hole {hole.number}</p>
          <p>
            {hole.status}; exposes {lines.get(hole.lineId)?.label ?? 'a line'}
            {hole.depthToTop != null && `; depth to top ${formatNumber(hole.depthToTop, 2)} ${u}`}
            {hole.surveyedTopElevation != null && `; top ${formatNumber(hole.surveyedTopElevation, 2)} ${u} ${project.verticalDatum}`}
          </p>
        </>
      );
    }
  } else if (selected?.type === 'bore') {
    const bore = bores.find((b) => b.id === selected.id);
    if (bore) body = <p className="font-semibold text-ink-900">{bore.name}</p>;
  } else if (selected?.type === 'pit') {
    const pit = pits.find((p) => p.id === selected.id);
    if (pit) {
      body = (
        <p>
          <span className="font-semibold text-ink-900">{pit.kind === 'launch' ? 'Launch' : 'Receiving'} pit</span>, bottom {formatNumber(pit.bottomElevation, 2)} {u}{' '}
          {project.verticalDatum}. Entry follows the excavation safety rules in force.
        </p>
      );
    }
  }
  return (
    <section className="rounded-lg border border-ink-200 bg-white p-3 text-sm text-ink-700" aria-live="polite" aria-label="Selection" data-testid="selection-card">
      <h2 className="mb-1 text-sm font-semibold text-ink-900">Selected</h2>
      {body}
    </section>
  );
}
