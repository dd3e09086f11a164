import { useState, type ReactNode } from 'react';
import type { BoreDto, ExportSummaryDto } from '@shared/api';
import { LINE_KIND_LABELS, type LineKind } from '@shared/domain';
import { STAKEOUT_SET_KINDS, STAKEOUT_SETS, type ConflictFilterBody, type GeojsonLayer, type StakeoutSet } from '@shared/schemas/export';
import { STAKE_POINT_KIND_LABELS } from '@shared/schemas/stakeout';
import { Alert, ProblemAlert } from '@/components/ui/alert';
import { Button, buttonClasses } from '@/components/ui/button';
import { CheckboxField, SelectField } from '@/components/ui/field';
import { Panel } from '@/components/ui/states';
import { formatNumber } from '@/lib/format';
import { exportUrl } from '../api/export-urls';
import { useBundleJob } from '../api/get-bundle-job';
import { useStartBundle } from '../api/start-bundle';

/** The conflict filter as query parameters (the list endpoint's names). */
export type ConflictQuery = Record<string, string | number | (string | number)[] | undefined>;

/** A link that downloads a file (the server names it with the project and the time). */
function DownloadLink({ href, children, primary = false }: { href: string; children: ReactNode; primary?: boolean }) {
  return (
    <a href={href} download className={buttonClasses(primary ? 'primary' : 'secondary')}>
      <svg aria-hidden viewBox="0 0 20 20" className="size-4 fill-current">
        <path d="M10 2a1 1 0 0 1 1 1v8.6l2.3-2.3a1 1 0 1 1 1.4 1.4l-4 4a1 1 0 0 1-1.4 0l-4-4a1 1 0 0 1 1.4-1.4L9 11.6V3a1 1 0 0 1 1-1ZM4 16a1 1 0 0 1 1-1h10a1 1 0 1 1 0 2H5a1 1 0 0 1-1-1Z" />
      </svg>
      {children}
    </a>
  );
}

/** `2.3 MB`, `840 kB`. */
export function formatBytes(bytes: number): string {
  if (bytes >= 1_000_000) return `${formatNumber(bytes / 1_000_000, 1)} MB`;
  return `${formatNumber(Math.max(1, Math.round(bytes / 1000)), 0)} kB`;
}

/** The conflict list as CSV, XLSX and PDF, of the filtered rows or everything. */
export function ConflictListExport({ projectId, query, rowsText }: { projectId: number; query: ConflictQuery; rowsText: ReactNode }) {
  const [spreadsheetIds, setSpreadsheetIds] = useState(false);
  return (
    <Panel title="Conflict list" headingLevel={3}>
      <div className="space-y-3 text-sm">
        <p className="text-ink-700">{rowsText}</p>
        <div className="flex flex-wrap gap-2">
          <DownloadLink href={exportUrl(projectId, 'conflicts.xlsx', query)} primary>
            Conflict list XLSX
          </DownloadLink>
          <DownloadLink href={exportUrl(projectId, 'conflicts.csv', { ...query, ids: spreadsheetIds ? 'spreadsheet' : undefined })}>Conflict list CSV</DownloadLink>
          <DownloadLink href={exportUrl(projectId, 'conflicts.pdf', query)}>Conflict list PDF</DownloadLink>
        </div>
        <CheckboxField
          label="CSV for opening straight in a spreadsheet"
          hint={<>Writes ids as ="007" so a spreadsheet keeps them as text (007, not 7). Leave it off for programs; the XLSX keeps ids as text either way.</>}
          checked={spreadsheetIds}
          onChange={(e) => setSpreadsheetIds(e.target.checked)}
        />
      </div>
    </Panel>
  );
}


/** The stake-out points as a point file and as DXF, for one bore or all. */
export function StakeoutExport({ projectId, bores, summary, unitText }: { projectId: number; bores: BoreDto[]; summary: ExportSummaryDto; unitText: string }) {
  const [boreId, setBoreId] = useState('');
  const [sets, setSets] = useState<StakeoutSet[]>([...STAKEOUT_SETS]);
  const toggle = (s: StakeoutSet, on: boolean) => setSets((all) => (on ? [...all, s] : all.filter((x) => x !== s)));
  const query = { boreId: boreId || undefined, set: sets.length === STAKEOUT_SETS.length ? undefined : sets };
  const none = sets.length === 0;
  return (
    <Panel title="Stake-out list" headingLevel={3}>
      <div className="space-y-3 text-sm">
        <p className="text-ink-700">
          {summary.counts.crossings} confirmed {summary.counts.crossings === 1 ? 'crossing' : 'crossings'} (elevation: top of line from the test holes) and{' '}
          {summary.counts.suggested} suggested test {summary.counts.suggested === 1 ? 'hole' : 'holes'} (elevation: ground from the bore profile), in {unitText}.
        </p>
        <div className="grid gap-3 sm:grid-cols-2">
          <SelectField label="Bore" value={boreId} onChange={(e) => setBoreId(e.target.value)}>
            <option value="">All bores</option>
            {bores.map((b) => (
              <option key={b.id} value={b.id}>
                {b.name}
              </option>
            ))}
          </SelectField>
          <fieldset className="space-y-1">
            <legend className="text-sm font-medium text-ink-800">Kind of point</legend>
            {STAKEOUT_SETS.map((s) => (
              <CheckboxField key={s} label={STAKE_POINT_KIND_LABELS[STAKEOUT_SET_KINDS[s]]} checked={sets.includes(s)} onChange={(e) => toggle(s, e.target.checked)} />
            ))}
          </fieldset>
        </div>
        {none ? (
          <p className="text-danger-700">Choose at least one kind of point.</p>
        ) : (
          <div className="flex flex-wrap gap-2">
            <DownloadLink href={exportUrl(projectId, 'stakeout.csv', query)} primary>
              Stake-out point file CSV
            </DownloadLink>
            <DownloadLink href={exportUrl(projectId, 'stakeout.dxf', query)}>Stake-out DXF</DownloadLink>
          </div>
        )}
        <p className="text-xs text-ink-500">
          Point names and descriptions are the Stake-out screen’s (X… confirmed crossing, SH… suggested test hole, P… pit corner). Point file columns: point, northing, easting, elevation, description, under a header block of lines starting with #. The DXF has a layer per line
          kind (UTIL-WATER, UTIL-GAS…) with true elevations as Z, the lines’ top where test holes give it as 3-D polylines, and the bore’s casing centreline.
        </p>
      </div>
    </Panel>
  );
}

const LAYER_LABELS: Record<GeojsonLayer, string> = { lines: 'Lines', holes: 'Test holes', bores: 'Bores' };

/** GeoJSON (RFC 7946, WGS 84 longitude/latitude) of lines, holes and bores. */
export function GeojsonExport({ projectId, kinds }: { projectId: number; kinds: LineKind[] }) {
  const [layers, setLayers] = useState<GeojsonLayer[]>(['lines', 'holes', 'bores']);
  const [kind, setKind] = useState('');
  const toggle = (l: GeojsonLayer, on: boolean) => setLayers((all) => (on ? [...all, l] : all.filter((x) => x !== l)));
  return (
    <Panel title="GeoJSON for GIS" headingLevel={3}>
      <div className="space-y-3 text-sm">
        <div className="grid gap-3 sm:grid-cols-2">
          <fieldset className="space-y-1">
            <legend className="text-sm font-medium text-ink-800">Layers</legend>
            {(['lines', 'holes', 'bores'] as GeojsonLayer[]).map((l) => (
              <CheckboxField key={l} label={LAYER_LABELS[l]} checked={layers.includes(l)} onChange={(e) => toggle(l, e.target.checked)} />
            ))}
          </fieldset>
          <SelectField label="Line kind" value={kind} onChange={(e) => setKind(e.target.value)}>
            <option value="">All kinds</option>
            {kinds.map((k) => (
              <option key={k} value={k}>
                {LINE_KIND_LABELS[k]}
              </option>
            ))}
          </SelectField>
        </div>
        {layers.length === 0 ? (
          <p className="text-danger-700">Choose at least one layer.</p>
        ) : (
          <DownloadLink href={exportUrl(projectId, 'project.geojson', { layers: layers.length === 3 ? undefined : layers, kind: kind || undefined })} primary>
            GeoJSON
          </DownloadLink>
        )}
        <p className="text-xs text-ink-500">
          Positions are [longitude, latitude] in WGS 84, as RFC 7946 requires; the grid coordinates and elevations stay in each feature’s properties.
        </p>
      </div>
    </Panel>
  );
}

/** The project zip: prepared on the server with progress, then downloaded. */
export function BundleExport({ projectId, filter, photoCount, filtered }: { projectId: number; filter: ConflictFilterBody; photoCount: number; filtered: boolean }) {
  const [photos, setPhotos] = useState(true);
  const [jobId, setJobId] = useState<string | null>(null);
  const start = useStartBundle(projectId);
  const job = useBundleJob(projectId, jobId);
  const current = job.data;
  const running = start.isPending || current?.state === 'running';

  const prepare = () => {
    setJobId(null);
    start.mutate({ filter: filtered ? filter : undefined, photos }, { onSuccess: (j) => setJobId(j.id) });
  };

  return (
    <Panel title="Everything in one zip" headingLevel={3}>
      <div className="space-y-3 text-sm">
        <p className="text-ink-700">
          The conflict list (CSV, XLSX, PDF), the stake-out point file and DXF, GeoJSON, lines and test holes as CSV, one PDF sheet per test hole, the
          photos named by hole number (TH-07_1.jpg) and a README.txt giving the CRS, unit, vertical datum and the time of the clearance check.
          {filtered ? ' The filter above narrows the conflict list, and its bores and kinds the other files.' : ''}
        </p>
        <CheckboxField
          label={`Include the photos (${photoCount})`}
          hint="Leave them out for a small file to send by e-mail."
          checked={photos}
          disabled={running}
          onChange={(e) => setPhotos(e.target.checked)}
        />
        <Button onClick={prepare} busy={running}>
          {current?.state === 'done' ? 'Prepare the zip again' : 'Prepare zip'}
        </Button>
        {start.isError && <ProblemAlert error={start.error} />}
        {job.isError && <ProblemAlert error={job.error} />}
        {current && current.state !== 'failed' && (
          <div className="space-y-2" aria-live="polite">
            <div className="flex items-center gap-3">
              <progress aria-label="Zip progress" max={100} value={current.percent} className="h-3 w-full max-w-md accent-brand-700" />
              <span className="tabular text-ink-700">{current.percent}%</span>
            </div>
            <p className="text-ink-600">{current.label}</p>
          </div>
        )}
        {current?.state === 'failed' && (
          <Alert tone="danger" title="The zip could not be made">
            <p>{current.error}</p>
          </Alert>
        )}
        {current?.state === 'done' && current.downloadUrl && (
          <div className="flex flex-wrap items-center gap-3">
            <a href={current.downloadUrl} download={current.fileName} className={buttonClasses('primary')}>
              Download zip
            </a>
            <span className="text-ink-600">
              {current.fileName}
              {current.byteSize != null && ` · ${formatBytes(current.byteSize)}`}. Kept on the server for 15 minutes.
            </span>
          </div>
        )}
      </div>
    </Panel>
  );
}
