import type { ApiRouter } from '../../http/api-router';
import { idOf } from '../../http/api-router';
import { notFound } from '../../errors';
import type { FileStorage } from '../../storage/storage';
import { loadHoleSheet, renderHoleSheets } from './hole-sheet';
import { TestHole } from './test-hole.entity';

/** The one-page test-hole sheet (PDF) of a hole's excavation. */
export function addSheetRoutes(api: ApiRouter, storage: FileStorage): void {
  api.get('/holes/:holeId/sheet.pdf', { access: 'export.read' }, async ({ em, project, params, res }) => {
    const hole = await em.findOne(TestHole, { id: idOf(params, 'holeId', 'Test hole'), project }, { populate: ['line', 'bore', 'createdBy'] });
    if (!hole) throw notFound('Test hole');
    const pdf = await renderHoleSheets([await loadHoleSheet(em, project, hole, storage)]);
    const name = `test-hole-${hole.number.replace(/[^A-Za-z0-9._-]+/g, '_')}.pdf`;
    res.set('Cache-Control', 'no-store').type('application/pdf').attachment(name).send(pdf);
  });
}
