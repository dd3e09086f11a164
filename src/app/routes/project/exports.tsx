import { NotBuiltYet } from '@/components/not-built';
import { useWorkspace } from './workspace-context';

/** Exports: placeholder until the export formats land. */
export default function ExportsTab() {
  const { project } = useWorkspace();
  return (
    <NotBuiltYet
      title="Exports"
      willShow={
        <>
          <p>Exports are not built yet. They will offer, for everything or for the filtered set:</p>
          <ul className="list-disc space-y-1 pl-5">
            <li>CSV of lines, test holes and conflicts (ids kept as text so spreadsheets do not mangle them);</li>
            <li>the conflict list as XLSX and PDF;</li>
            <li>a one-page PDF per test hole with its photos and a small map;</li>
            <li>GeoJSON of lines, holes and bores, and DXF with a layer per line kind and true elevations;</li>
            <li>one zip with the data and the photos named by hole number.</li>
          </ul>
          <p>
            Every file will state its CRS ({project.crsCode}), unit and vertical datum ({project.verticalDatum}) in its header.
          </p>
        </>
      }
    />
  );
}
