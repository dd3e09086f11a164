import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import Papa from 'papaparse';
import type { AdminMailDto, CapturedMailDetailDto, ConflictEventDto, ConflictRowDto, MailOwnersResultDto } from '@shared/api';
import { CONFLICT_STATUS_LABELS } from '@shared/domain';
import { formatStation } from '@shared/geometry';
import { createApp } from '@server/app';
import { randomUUID } from 'node:crypto';
import { Conflict, OutboxMessage, Project, TestHole, UtilityLine } from '@server/entities';
import { recomputeConflicts } from '@server/modules/clearances/clearance.service';
import { startMail, type MailRuntime } from '@server/modules/mail/mail-runtime';
import { deliverDue, retryDelayMs } from '@server/modules/mail/outbox';
import { loopbackSender } from '@server/modules/mail/transport';
import { makeFixtures, makeTestApp, tableCounts, type Fixtures, type TestContext } from './helpers';
import { closedPort, startTestSmtp, type TestSmtp } from './mail-support';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await makeTestApp();
});
afterAll(() => ctx.close());

const FROM = 'Threadline <threadline@test.example.com>';
type Role = Parameters<TestContext['cookie']>[0];
const post = (url: string, body: object, role: Role = 'manager') => request(ctx.app).post(url).set('Cookie', ctx.cookie(role)).send(body);
const get = (url: string, role: Role = 'viewer') => request(ctx.app).get(url).set('Cookie', ctx.cookie(role));

/** A fixture whose water line has a contact, plus a second (gas) line of another owner with none. */
async function fixtureWithContacts(): Promise<Fixtures & { gasLabel: string }> {
  const f = await makeFixtures(ctx);
  const em = ctx.orm.em.fork();
  const line = await em.findOneOrFail(UtilityLine, f.line.id);
  line.contactEmail = 'engineering@water.test.example.com';
  await em.flush();
  // A gas main of another owner crossing at E 3,000,200 (station 12+00), no contact, lying on the casing.
  const res = await request(ctx.app)
    .post(`/api/projects/${f.project.id}/lines`)
    .set('Cookie', ctx.cookie('designer'))
    .send({ label: 'G-1', owner: 'Test gas company', kind: 'gas', shape: 'round', diameter: 0.5, status: 'active', qualityLevel: 'D', path: [[3000200, 13799900], [3000200, 13800100]], recordDepth: 0, contactEmail: '' });
  expect(res.status).toBe(201);
  // TH-2 exposes it: ground 100.0, depth 14.5 → top 85.50, bottom 85.00; the casing top at 12+00 is
  // 85 − 200/250 + 1.5 = 85.70 → clearance −0.70 US ft: an overlap, on a line with no contact.
  const em2 = ctx.orm.em.fork();
  const gas = await em2.findOneOrFail(UtilityLine, res.body.id as number);
  const hole = new TestHole(gas.project, gas, randomUUID(), 'TH-2', 3000200, 13800005);
  hole.status = 'dug';
  hole.groundElevation = 100;
  hole.depthToTop = 14.5;
  em2.persist(hole);
  await em2.flush();
  await recomputeConflicts(em2, await em2.findOneOrFail(Project, f.project.id), null);
  await em2.flush();
  return { ...f, gasLabel: 'G-1' };
}

describe('mailing the line owners their conflicts', () => {
  let f: Fixtures & { gasLabel: string };
  let smtp: TestSmtp;
  beforeAll(async () => {
    f = await fixtureWithContacts();
    smtp = await startTestSmtp();
  });
  afterAll(() => smtp.close());

  it('when the manager asks for a preview, then it says who gets what and queues nothing', async () => {
    const before = await tableCounts(ctx.orm);
    const res = await post(`/api/projects/${f.project.id}/mail/owners`, { mode: 'preview' });
    expect(res.status).toBe(200);
    const body = res.body as MailOwnersResultDto;
    expect(body.mode).toBe('preview');
    expect(body.recipients).toHaveLength(1);
    expect(body.recipients[0]).toMatchObject({
      to: 'engineering@water.test.example.com',
      owners: ['Test water district'],
      lines: [{ id: f.line.id, label: 'W-1' }],
      conflicts: [{ id: f.conflict.id, number: `C-${f.conflict.id}` }],
      outboxId: null,
    });
    expect(body.recipients[0]!.attachmentName).toMatch(/^conflicts-.+-test-water-district-\d{4}-\d{2}-\d{2}\.csv$/);
    // The gas line fails too but has no contact: reported, not mailed.
    expect(body.skipped).toHaveLength(1);
    expect(body.skipped[0]).toMatchObject({ owner: 'Test gas company', lines: ['G-1'] });
    expect(body.skipped[0]!.reason).toMatch(/No contact e-mail/);
    expect(await tableCounts(ctx.orm)).toEqual(before);
  });

  it('when the body is empty or names a contact with no conflicts, then 400 names the field', async () => {
    const empty = await post(`/api/projects/${f.project.id}/mail/owners`, {});
    expect(empty.status).toBe(400);
    expect(empty.body.errors[0].path).toBe('mode');
    const stranger = await post(`/api/projects/${f.project.id}/mail/owners`, { mode: 'send', contacts: ['nobody@test.example.com'] });
    expect(stranger.status).toBe(400);
    expect(stranger.body.errors[0].path).toBe('contacts.0');
  });

  it('when a designer or reviewer tries to mail owners, then 403', async () => {
    for (const role of ['designer', 'viewer', 'field'] as const) expect((await post(`/api/projects/${f.project.id}/mail/owners`, { mode: 'preview' }, role)).status).toBe(403);
  });

  it('when the manager sends, then the owner gets one message with the list attached as CSV, and the register records it', async () => {
    const res = await post(`/api/projects/${f.project.id}/mail/owners`, { mode: 'send', contacts: ['engineering@water.test.example.com'], message: 'Please confirm your clearance for W-1.' });
    expect(res.status).toBe(200);
    const body = res.body as MailOwnersResultDto;
    const outboxId = body.recipients[0]!.outboxId!;
    expect(outboxId).toBeGreaterThan(0);

    // The register: owner told today, and an owner_mailed entry in the history.
    const row = (await get(`/api/projects/${f.project.id}/conflicts/${f.conflict.id}`)).body as ConflictRowDto;
    expect(row.ownerNotifiedAt).not.toBeNull();
    const history = (await get(`/api/projects/${f.project.id}/conflicts/${f.conflict.id}/history`)).body as ConflictEventDto[];
    expect(history.at(-1)).toMatchObject({ kind: 'owner_mailed', byName: 'Test manager', data: { to: 'engineering@water.test.example.com', outboxId } });

    const em = ctx.orm.em.fork();
    const report = await deliverDue(em, loopbackSender(smtp.port), FROM, new Date());
    expect(report.sent).toEqual([outboxId]);

    // What went over SMTP, read back with mailparser.
    expect(smtp.messages.map((m) => m.envelopeTo)).toEqual([['engineering@water.test.example.com']]);
    const [mail] = await smtp.parsed();
    expect(mail!.subject).toBe(`${f.project.name}: 1 conflict with Test water district lines`);
    expect(mail!.from?.value[0]?.address).toBe('threadline@test.example.com');
    expect(mail!.replyTo?.value[0]?.address).toBe('manager@test.example.com');
    expect(mail!.text).toContain('Please confirm your clearance for W-1.');
    expect(mail!.text).toContain('Grid EPSG:2278; lengths in US survey feet; elevations NAVD 88');
    expect(mail!.attachments).toHaveLength(1);
    const attachment = mail!.attachments[0]!;
    expect(attachment.filename).toBe(body.recipients[0]!.attachmentName);
    expect(attachment.contentType).toBe('text/csv');

    // The attachment is the exports' conflict list CSV (same header block and columns as
    // GET /exports/conflicts.csv), narrowed to this contact, read with papaparse.
    const csv = attachment.content.toString('utf8');
    const header = csv.replace(/^\ufeff/, '').split('\r\n').filter((l) => l.startsWith('#'));
    expect(header[0]).toBe('# Threadline: conflict list');
    expect(header.some((l) => l.startsWith(`# Project: ${f.project.name} (`))).toBe(true);
    expect(header).toContain('# CRS: EPSG:2278 NAD83 / Texas South Central (ftUS)');
    expect(header.some((l) => l.startsWith('# Unit: US survey feet (US ft)'))).toBe(true);
    expect(header).toContain('# Vertical datum: NAVD 88');
    expect(header).toContain('# Rows: 1 of 2 conflicts; filter: status = Open; In review; owner contact = engineering@water.test.example.com');
    // The check time is the register's last check, and the message text states the same minute.
    const checked = header.find((l) => l.startsWith('# Clearances checked: '))!;
    expect(checked).toMatch(/^# Clearances checked: \d{4}-\d\d-\d\dT\d\d:\d\d:\d\dZ \(UTC; the conflict register's last check/);
    const minute = checked.slice('# Clearances checked: '.length, '# Clearances checked: '.length + 16).replace('T', ' ');
    expect(mail!.text).toContain(`last clearance check ${minute} UTC`);
    const parsed = Papa.parse<Record<string, string>>(csv, { header: true, comments: '#', skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.data).toHaveLength(1);
    // Hand-worked figures of the fixture crossing (see conflicts.test.ts): station 11+00 on the
    // alignment, top of line 86.00, clearance −1.10 against 1.50 required; 1.000 US ft = 12.0 in.
    const listed = parsed.data[0]!;
    expect(listed).toMatchObject({
      Conflict: `C-${f.conflict.id}`,
      'Bore or pit': 'Bore 1',
      'Station (governing)': '11+00.00',
      Side: '',
      Owner: 'Test water district',
      'Owner contact': 'engineering@water.test.example.com',
      Line: 'W-1',
      Kind: 'Potable water',
      'Size (outside)': '1.000 US ft (12.0 in)',
      'Quality level': 'D',
      'Test holes': 'TH-1',
      'Last check': 'Overlap',
      Status: 'Open',
    });
    expect(Number(listed['Offset (US ft)'])).toBeCloseTo(0, 6);
    expect(Number(listed['Top of line (US ft NAVD 88)'])).toBeCloseTo(86, 6);
    expect(Number(listed['Required clearance (US ft)'])).toBeCloseTo(1.5, 6);
    expect(Number(listed['Measured clearance (US ft)'])).toBeCloseTo(-1.1, 6);
  });

  it('when the message is in the outbox, then an administrator sees it sent on Admin → Mail; others get 403', async () => {
    const res = await get('/api/admin/mail', 'admin');
    expect(res.status).toBe(200);
    const body = res.body as AdminMailDto;
    const sent = body.outbox.find((m) => m.purpose === 'owner_conflicts' && m.to === 'engineering@water.test.example.com');
    expect(sent).toMatchObject({ status: 'sent', attempts: 1, lastError: null });
    expect(sent!.attachments[0]!.filename).toMatch(/\.csv$/);
    expect((await get('/api/admin/mail', 'manager')).status).toBe(403);
  });
});

describe('the register list, the CSV export and the owner mail attachments agree', () => {
  it('when both lines have a contact and one conflict is in review, then all three give the same conflicts, statuses, figures and check time', async () => {
    const f = await fixtureWithContacts();
    const em = ctx.orm.em.fork();
    const gas = await em.findOneOrFail(UtilityLine, { project: f.project.id, label: f.gasLabel });
    gas.contactEmail = 'locates@gas.test.example.com'; // a contact changes no clearance: no recheck needed
    await em.flush();
    const w1 = (await get(`/api/projects/${f.project.id}/conflicts/${f.conflict.id}`)).body as ConflictRowDto;
    const moved = await request(ctx.app)
      .patch(`/api/projects/${f.project.id}/conflicts/${f.conflict.id}/status`)
      .set('Cookie', ctx.cookie('designer'))
      .send({ status: 'in_review', reason: 'Checking the profile', version: w1.version });
    expect(moved.status).toBe(200);

    // 1. The register list (the Conflicts screen), for the statuses the mail sends by default.
    const register = (await get(`/api/projects/${f.project.id}/conflicts?status=open,in_review`)).body as ConflictRowDto[];
    expect(register.map((r) => r.status).sort()).toEqual(['in_review', 'open']);
    // 2. The CSV a manager exports for that filter.
    const exported = await get(`/api/projects/${f.project.id}/exports/conflicts.csv?status=open,in_review`, 'manager');
    expect(exported.status).toBe(200);
    // 3. The owner mail: one message per contact, each with its CSV, read back over SMTP.
    const smtp = await startTestSmtp();
    const attachments: string[] = [];
    try {
      const sent = await post(`/api/projects/${f.project.id}/mail/owners`, { mode: 'send' });
      expect(sent.status).toBe(200);
      const ids = (sent.body as MailOwnersResultDto).recipients.map((r) => r.outboxId!);
      expect(ids).toHaveLength(2);
      const report = await deliverDue(ctx.orm.em.fork(), loopbackSender(smtp.port), FROM, new Date());
      expect(report.sent.filter((id) => ids.includes(id)).sort()).toEqual([...ids].sort());
      for (const m of await smtp.parsed()) if (m.subject?.startsWith(f.project.name)) attachments.push(m.attachments[0]!.content.toString('utf8'));
    } finally {
      await smtp.close();
    }
    expect(attachments).toHaveLength(2);

    // Read every CSV with papaparse; compare what matters: number, status, last check and figures.
    const read = (csv: string) => Papa.parse<Record<string, string>>(csv, { header: true, comments: '#', skipEmptyLines: true }).data;
    const fromCsv = (r: Record<string, string>) => ({
      number: r.Conflict,
      status: r.Status,
      line: r.Line,
      station: r['Station (governing)'],
      clearance: Number(r['Measured clearance (US ft)']),
      required: Number(r['Required clearance (US ft)']),
      margin: Number(r['Margin (US ft)']),
      lineTop: Number(r['Top of line (US ft NAVD 88)']),
    });
    const round = (v: number | null) => (v == null ? Number.NaN : Math.round(v * 10_000) / 10_000);
    const fromRegister = register.map((r) => ({
      number: r.number,
      status: CONFLICT_STATUS_LABELS[r.status],
      line: r.line.label,
      station: r.station == null ? '' : formatStation(r.station, '100'),
      clearance: round(r.clearance),
      required: round(r.required),
      margin: round(r.margin),
      lineTop: round(r.lineTop),
    }));
    const byNumber = <T extends { number: string | undefined }>(rows: T[]) => [...rows].sort((a, b) => String(a.number).localeCompare(String(b.number)));
    const exportRows = read(exported.text).map(fromCsv);
    const mailRows = attachments.flatMap((csv) => read(csv).map(fromCsv));
    expect(byNumber(exportRows)).toEqual(byNumber(fromRegister));
    expect(byNumber(mailRows)).toEqual(byNumber(fromRegister));
    // Hand-worked (fixture comments above): W-1 clearance −1.10, G-1 −0.70 US ft.
    expect(fromRegister.map((r) => r.clearance).sort((a, b) => a - b)).toEqual([-1.1, -0.7]);
    expect(fromRegister.map((r) => r.station).sort()).toEqual(['11+00.00', '12+00.00']);

    // Every file states the register's last check: the latest time the check wrote on the conflicts.
    const stored = await ctx.orm.em.fork().find(Conflict, { project: f.project.id });
    const last = new Date(Math.max(...stored.map((c) => c.checkedAt.getTime()))).toISOString().replace(/\.\d{3}Z$/, 'Z');
    for (const csv of [exported.text, ...attachments]) expect(csv).toContain(`# Clearances checked: ${last} (UTC; the conflict register's last check`);
  });
});

describe('mail sent while the SMTP server is down is delivered after it comes back', () => {
  it('when the server is down, then the message waits with its attempts and backoff; once up, it is delivered once', async () => {
    const f = await fixtureWithContacts();
    const port = await closedPort();
    const res = await post(`/api/projects/${f.project.id}/mail/owners`, { mode: 'send' });
    expect(res.status).toBe(200);
    const id = (res.body as MailOwnersResultDto).recipients[0]!.outboxId!;
    const sender = loopbackSender(port);
    const em = () => ctx.orm.em.fork();
    const t0 = new Date('2030-01-01T08:00:00Z');
    const at = (seconds: number) => new Date(t0.getTime() + seconds * 1000);

    // First pass: connection refused → attempt 1, retry in 30 s.
    let report = await deliverDue(em(), sender, FROM, t0);
    expect(report.deferred).toContain(id);
    let m = await em().findOneOrFail(OutboxMessage, id);
    expect(m.status).toBe('queued');
    expect(m.attempts).toBe(1);
    expect(m.lastError).toMatch(/ECONNREFUSED/);
    expect(m.nextAttemptAt!.toISOString()).toBe(at(30).toISOString());

    // Not due yet: nothing is tried.
    report = await deliverDue(em(), sender, FROM, at(10));
    expect(report.deferred).not.toContain(id);
    expect((await em().findOneOrFail(OutboxMessage, id)).attempts).toBe(1);

    // Second failure doubles the wait: 60 s.
    await deliverDue(em(), sender, FROM, at(30));
    m = await em().findOneOrFail(OutboxMessage, id);
    expect(m.attempts).toBe(2);
    expect(m.nextAttemptAt!.toISOString()).toBe(at(90).toISOString());

    // The server comes back on the same port; the next due pass delivers it.
    const smtp = await startTestSmtp(port);
    try {
      report = await deliverDue(em(), sender, FROM, at(90));
      expect(report.sent).toContain(id);
      m = await em().findOneOrFail(OutboxMessage, id);
      expect(m.status).toBe('sent');
      expect(m.attempts).toBe(3);
      expect(m.sentAt!.toISOString()).toBe(at(90).toISOString());
      const mails = await smtp.parsed();
      expect(mails).toHaveLength(1);
      expect(mails[0]!.attachments[0]!.filename).toMatch(/\.csv$/);
      // Nothing is sent twice.
      report = await deliverDue(em(), sender, FROM, at(10_000));
      expect(report.sent).not.toContain(id);
      expect(smtp.messages).toHaveLength(1);
    } finally {
      await smtp.close();
    }
  });

  it('backoff doubles from 30 s and stops growing at one hour', () => {
    expect([1, 2, 3, 4].map(retryDelayMs)).toEqual([30_000, 60_000, 120_000, 240_000]);
    expect(retryDelayMs(7)).toBe(1_920_000); // 30 s × 2^6 = 32 min
    expect(retryDelayMs(8)).toBe(3_600_000); // 30 s × 2^7 = 64 min, held at 60
    expect(retryDelayMs(50)).toBe(3_600_000);
  });

  it('when the server refuses the recipient for good (550), then the message is failed, kept, and can be queued again', async () => {
    const f = await fixtureWithContacts();
    const smtp = await startTestSmtp(0, { rejectRcpt: true });
    try {
      const res = await post(`/api/projects/${f.project.id}/mail/owners`, { mode: 'send' });
      const id = (res.body as MailOwnersResultDto).recipients[0]!.outboxId!;
      const report = await deliverDue(ctx.orm.em.fork(), loopbackSender(smtp.port), FROM, new Date());
      expect(report.failed).toContain(id);
      const m = await ctx.orm.em.fork().findOneOrFail(OutboxMessage, id);
      expect(m.status).toBe('failed');
      expect(m.lastError).toMatch(/550/);
      const retry = await post(`/api/admin/mail/outbox/${id}/retry`, {}, 'admin');
      expect(retry.status).toBe(200);
      expect(retry.body.status).toBe('queued');
      expect((await post(`/api/admin/mail/outbox/${id}/retry`, {}, 'manager')).status).toBe(403);
    } finally {
      await smtp.close();
    }
  });
});

describe('the built-in development catcher and the worker', () => {
  let mail: MailRuntime;
  let app: ReturnType<typeof createApp>;
  beforeAll(async () => {
    const config = { ...ctx.config, mail: { ...ctx.config.mail, capture: true, capturePort: 0 } };
    mail = await startMail(config, ctx.orm);
    app = createApp({ orm: ctx.orm, config, storage: ctx.storage, mail });
  });
  afterAll(() => mail.close());

  it('when mail is sent in development, then the catcher holds it and Admin → Mail lists it with its attachment', async () => {
    expect(mail.mode).toBe('capture');
    const f = await fixtureWithContacts();
    const sent = await request(app).post(`/api/projects/${f.project.id}/mail/owners`).set('Cookie', ctx.cookie('manager')).send({ mode: 'send' });
    expect(sent.status).toBe(200);
    const report = await mail.worker.deliverDue(new Date());
    expect(report.sent.length).toBeGreaterThanOrEqual(1);
    const res = await request(app).get('/api/admin/mail').set('Cookie', ctx.cookie('admin'));
    const body = res.body as AdminMailDto;
    expect(body.mode).toBe('capture');
    expect(body.captureAddress).toMatch(/^127\.0\.0\.1:\d+$/);
    const caught = body.captured.find((c) => c.subject === `${f.project.name}: 1 conflict with Test water district lines`);
    expect(caught).toBeDefined();
    expect(caught!.to).toEqual(['engineering@water.test.example.com']);
    expect(caught!.attachments[0]!.filename).toMatch(/\.csv$/);
    const detail = (await request(app).get(`/api/admin/mail/captured/${caught!.id}`).set('Cookie', ctx.cookie('admin'))).body as CapturedMailDetailDto;
    expect(detail.text).toContain('W-1');
  });

  it('when an assignee’s due date is a day away, then the worker queues one reminder per due date', async () => {
    const f = await fixtureWithContacts();
    const conflict = (await request(app).get(`/api/projects/${f.project.id}/conflicts/${f.conflict.id}`).set('Cookie', ctx.cookie('viewer'))).body as ConflictRowDto;
    const assign = await request(app)
      .patch(`/api/projects/${f.project.id}/conflicts/${f.conflict.id}/assignment`)
      .set('Cookie', ctx.cookie('manager'))
      .send({ assigneeId: ctx.users.designer.id, dueDate: '2030-06-02', version: conflict.version });
    expect(assign.status).toBe(200);
    const reminders = async () => (await ctx.orm.em.fork().find(OutboxMessage, { project: f.project.id, purpose: 'due_reminder' })).length;
    await mail.worker.deliverDue(new Date('2030-05-30T12:00:00Z')); // three days ahead: nothing yet
    expect(await reminders()).toBe(0);
    await mail.worker.deliverDue(new Date('2030-06-01T12:00:00Z')); // within a day
    await mail.worker.deliverDue(new Date('2030-06-01T18:00:00Z')); // again: no second reminder
    expect(await reminders()).toBe(1);
    const [m] = await ctx.orm.em.fork().find(OutboxMessage, { project: f.project.id, purpose: 'due_reminder' });
    expect(m!.to).toBe('designer@test.example.com');
    expect(m!.subject).toBe(`Due 2030-06-02: C-${f.conflict.id} W-1 × Bore 1`);
  });
});
