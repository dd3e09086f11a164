import type { HoleDto } from '@shared/api';
import { LINE_KIND_LABELS } from '@shared/domain';
import type { OutboxHole } from '@/features/outbox/outbox-store';
import { KEPT_BADGE, toRows, type HoleRow, type HoleTableContext } from '../components/holes-table';

/**
 * Outbox records that belong in a project's register: hole-creates of that project the server has
 * not kept yet (waiting, sending or refused), minus any whose client id the server list already
 * holds. The server's hole carries the same client id as the record it came from, so a hole is
 * never listed twice, whatever order the list and the outbox are re-read in.
 */
export function keptRecords(records: readonly OutboxHole[], serverHoles: readonly HoleDto[], projectId: number): OutboxHole[] {
  const onServer = new Set(serverHoles.map((h) => h.clientId));
  return records.filter((r) => r.projectId === projectId && r.status !== 'sent' && r.holeId == null && !onServer.has(r.clientId));
}

/**
 * The figures a kept record has, in the shape the register's cells read. Only what the crew
 * entered is filled: no server id (never linked), no survey or review values; the status is the
 * one the server gives a new hole (`dug`), but kept rows are filtered and counted on their own.
 */
function keptHole(r: OutboxHole): HoleDto {
  const i = r.input;
  return {
    id: 0,
    projectId: r.projectId,
    clientId: r.clientId,
    number: i.number,
    lineId: i.lineId ?? 0,
    status: 'dug',
    positionSource: i.positionSource,
    easting: i.easting ?? Number.NaN,
    northing: i.northing ?? Number.NaN,
    approximate: i.positionSource === 'gps',
    boreId: i.boreId ?? null,
    station: i.station ?? null,
    offset: i.offset ?? null,
    offsetSide: i.offsetSide ?? null,
    gpsAccuracy: i.gpsAccuracy ?? null,
    groundElevation: i.groundElevation ?? null,
    depthToTop: i.depthToTop ?? null,
    depthReference: i.depthReference,
    measuredSize: i.measuredSize ?? null,
    boxWidth: i.boxWidth ?? null,
    boxHeight: i.boxHeight ?? null,
    depthToBottom: i.depthToBottom ?? null,
    material: i.material ?? null,
    condition: i.condition ?? null,
    direction: i.direction ?? null,
    method: i.method ?? null,
    ticketNumber: i.ticketNumber ?? null,
    surfaceType: i.surfaceType ?? null,
    markerSet: i.markerSet ?? null,
    crew: i.crew ?? null,
    dugAt: i.dugAt ?? null,
    surveyedEasting: null,
    surveyedNorthing: null,
    surveyedTopElevation: null,
    surveyedGroundElevation: null,
    reviewNote: null,
    notes: i.notes ?? null,
    soil: i.soil ?? null,
    groundwater: i.groundwater ?? null,
    restoration: i.restoration ?? null,
    createdById: null,
    photoCount: r.photos.length,
    version: 0,
    createdAt: r.madeAt,
    updatedAt: r.madeAt,
  };
}

/** Register rows for kept records (see {@link keptRecords} for which records). */
export function keptRows(records: readonly OutboxHole[], ctx: HoleTableContext): HoleRow[] {
  return records.map((r) => {
    const [row] = toRows([keptHole(r)], ctx);
    const newLine = r.input.newLine?.label ?? null;
    const photoProblem = r.photos.find((p) => p.status === 'refused');
    const kept = {
      clientId: r.clientId,
      status: r.status,
      reason: r.reason,
      newLine,
      photoProblem: photoProblem ? `photo ${photoProblem.name}: ${photoProblem.reason ?? ''}` : undefined,
    };
    // A line on no record has no id yet: it is filtered under a key of its own (negative, never a server id).
    const lineId = newLine != null ? -r.seq : row!.lineId;
    const lineLabel = newLine ?? row!.lineLabel;
    return {
      ...row!,
      kept,
      statusOrder: -1,
      lineId,
      lineLabel,
      lineKind: newLine != null ? 'unknown' : row!.lineKind,
      qualityLevel: newLine != null ? undefined : row!.qualityLevel,
      clearance: newLine != null ? null : row!.clearance,
      clearanceOrder: newLine != null ? undefined : row!.clearanceOrder,
      search: [r.input.number, lineLabel, newLine != null ? `new line ${LINE_KIND_LABELS.unknown}` : row!.lineKind ? LINE_KIND_LABELS[row!.lineKind] : '', r.input.crew, r.input.material, r.input.condition, r.input.ticketNumber, r.input.surfaceType, r.input.notes, KEPT_BADGE, 'not sent']
        .filter(Boolean)
        .join(' \u0001 ')
        .toLowerCase(),
    };
  });
}

/** The register: the server's holes, then this project's kept records the server does not have. */
export function registerRows(serverHoles: readonly HoleDto[], records: readonly OutboxHole[], ctx: HoleTableContext): HoleRow[] {
  return [...toRows(serverHoles, ctx), ...keptRows(keptRecords(records, serverHoles, ctx.projectId), ctx)];
}
