import { BORE_METHOD_LABELS, LINE_KIND_LABELS, type LineKind } from '@shared/domain';
import { gridToLonLat, projectCrs, type CrsDefinition } from '@shared/geometry';
import type { GeojsonLayer } from '@shared/schemas/export';
import type { ExportFrame, ProjectExportData } from './export-data';
import { DESIGN_AID_CAUTION, isoSeconds, round4 } from './export-header';

/**
 * GeoJSON (RFC 7946) of lines, holes and bores: positions in WGS 84 longitude and latitude
 * (RFC 7946 §4 allows no other CRS, and §3.1.1 fixes the order [longitude, latitude]), converted
 * from the project grid with proj4 through shared/geometry. The grid values stay in each
 * feature's properties, in the project unit; elevations are properties on the project's
 * vertical datum, never a third coordinate (RFC 7946 §3.1.1 makes that height above the WGS 84
 * ellipsoid in metres). The frame goes in a foreign member, `threadline` (RFC 7946 §6.1).
 */

type Position = [number, number];
interface Feature {
  type: 'Feature';
  id: string;
  geometry: { type: 'Point'; coordinates: Position } | { type: 'LineString'; coordinates: Position[] };
  properties: Record<string, unknown>;
}

export interface GeojsonFilter {
  layers?: GeojsonLayer[];
  kind?: LineKind[];
}

/** 7 decimals of a degree ≈ 1 cm; more would claim a precision the datum shift does not have. */
const DEG = 1e7;
const deg = (v: number) => Math.round(v * DEG) / DEG;

export function projectGeojson(data: ProjectExportData, filter: GeojsonFilter = {}): object {
  const { frame } = data;
  const layers = filter.layers?.length ? filter.layers : (['lines', 'holes', 'bores'] as GeojsonLayer[]);
  let crs: CrsDefinition | string = frame.crsProj4;
  try {
    crs = projectCrs(frame.crsCode, frame.crsProj4);
  } catch {
    crs = frame.crsProj4;
  }
  // Points outside the CRS's area of use are still converted: the export shows the data as it is.
  const toLonLat = (e: number, n: number): Position => {
    const [lon, lat] = gridToLonLat(crs, [e, n], { unit: frame.unit, checkArea: false });
    return [deg(lon), deg(lat)];
  };
  const kindOk = (k: LineKind) => !filter.kind?.length || filter.kind.includes(k);
  const features: Feature[] = [];
  const u = frame.unit;

  if (layers.includes('bores')) {
    for (const b of data.bores) {
      features.push({
        type: 'Feature',
        id: `bore-${b.id}`,
        geometry: { type: 'LineString', coordinates: b.alignment.map(([e, n]) => toLonLat(e, n)) },
        properties: {
          featureType: 'bore',
          id: b.id,
          name: b.name,
          method: BORE_METHOD_LABELS[b.method],
          beginStation: round4(b.beginStation),
          casingOutsideDiameter: round4(b.casingOd),
          profile: b.profile,
          gridCoordinates: b.alignment,
          unit: u,
        },
      });
    }
  }
  if (layers.includes('lines')) {
    for (const l of data.lines) {
      if (!kindOk(l.kind)) continue;
      features.push({
        type: 'Feature',
        id: `line-${l.id}`,
        geometry: { type: 'LineString', coordinates: l.path.map(([e, n]) => toLonLat(e, n)) },
        properties: {
          featureType: 'line',
          id: l.id,
          label: l.label,
          owner: l.owner,
          contactEmail: l.contactEmail,
          kind: l.kind,
          kindLabel: LINE_KIND_LABELS[l.kind],
          shape: l.shape,
          diameter: l.diameter,
          width: l.width,
          height: l.height,
          material: l.material,
          status: l.status,
          qualityLevel: l.qualityLevel,
          recordDepth: l.recordDepth,
          gridCoordinates: l.path,
          unit: u,
        },
      });
    }
  }
  if (layers.includes('holes')) {
    for (const h of data.holes) {
      const line = data.linesById.get(h.lineId);
      if (!line || !kindOk(line.kind)) continue;
      features.push({
        type: 'Feature',
        id: `hole-${h.id}`,
        geometry: { type: 'Point', coordinates: toLonLat(h.easting, h.northing) },
        properties: {
          featureType: 'hole',
          id: h.id,
          number: h.number,
          lineId: h.lineId,
          lineLabel: line.label,
          kind: line.kind,
          status: h.status,
          positionSource: h.positionSource,
          surveyedPosition: h.surveyed,
          approximate: h.approximate,
          gridEasting: round4(h.easting),
          gridNorthing: round4(h.northing),
          station: round4(h.station),
          offset: round4(h.offset),
          offsetSide: h.offsetSide,
          groundElevation: round4(h.groundElevation),
          depthToTop: round4(h.depthToTop),
          depthReference: h.depthReference,
          topElevation: round4(h.topElevation),
          material: h.material,
          condition: h.condition,
          dugAt: h.dugAt ? h.dugAt.toISOString() : null,
          unit: u,
          verticalDatum: frame.verticalDatum,
        },
      });
    }
  }

  let bbox: [number, number, number, number] | undefined;
  for (const f of features) {
    const coords = f.geometry.type === 'Point' ? [f.geometry.coordinates] : f.geometry.coordinates;
    for (const [lon, lat] of coords) {
      if (!bbox) bbox = [lon, lat, lon, lat];
      else bbox = [Math.min(bbox[0], lon), Math.min(bbox[1], lat), Math.max(bbox[2], lon), Math.max(bbox[3], lat)];
    }
  }

  return {
    type: 'FeatureCollection',
    ...(bbox ? { bbox } : {}),
    name: `${frame.projectName}: lines, test holes and bores`,
    coordinateOrder: '[longitude, latitude] in decimal degrees, WGS 84 (RFC 7946 sections 3.1.1 and 4)',
    threadline: metadata(frame, layers, filter),
    features,
  };
}

function metadata(frame: ExportFrame, layers: GeojsonLayer[], filter: GeojsonFilter) {
  return {
    coordinateOrder: 'longitude, latitude',
    positionsCrs: 'WGS 84 longitude/latitude (OGC CRS84), converted from the project grid with proj4',
    projectCrs: frame.crsCode,
    projectCrsName: frame.crsName,
    projectCrsProj4: frame.crsProj4,
    unit: frame.unit,
    unitLabel: frame.unitLabel,
    verticalDatum: frame.verticalDatum,
    gridValues: `gridCoordinates ([easting, northing] pairs) and gridEasting/gridNorthing in properties are in ${frame.crsCode}, ${frame.unitLabel}`,
    elevations: `groundElevation, topElevation and profile elevations are ${frame.unitLabel} on ${frame.verticalDatum}; positions carry no third value`,
    datumNote: 'the grid datum is taken equal to WGS 84 for the conversion where the definition gives no shift (NAD83: about 1 m); survey work uses the grid values',
    clearancesCheckedAt: frame.check.at ? isoSeconds(frame.check.at) : null,
    exportedAt: isoSeconds(frame.exportedAt),
    exportedBy: frame.exportedBy,
    layers,
    kinds: filter.kind?.length ? filter.kind : 'all',
    caution: DESIGN_AID_CAUTION,
  };
}
