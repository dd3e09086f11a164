/** The export files a browser downloads directly (GET with the filter as query parameters). */
export type ExportFile = 'conflicts.csv' | 'conflicts.xlsx' | 'conflicts.pdf' | 'stakeout.csv' | 'stakeout.dxf' | 'project.geojson';

type Params = Record<string, string | number | readonly (string | number)[] | null | undefined>;

/** `/api/projects/3/exports/conflicts.csv?status=open,in_review&kind=gas`; empty parts are left out. */
export function exportUrl(projectId: number, file: ExportFile, params: Params = {}): string {
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(params)) {
    if (value === null || value === undefined || value === '') continue;
    if (Array.isArray(value)) {
      if (value.length > 0) search.set(key, value.join(','));
    } else search.set(key, String(value));
  }
  const qs = search.toString();
  return `/api/projects/${projectId}/exports/${file}${qs ? `?${qs}` : ''}`;
}
