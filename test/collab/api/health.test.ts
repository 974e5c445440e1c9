import { parseHealthReport } from '@rampart/collab/api/health';

describe('parseHealthReport', () => {
  const good = {
    status: 'ok',
    server: { status: 'up', version: '0.1.0', uptimeSeconds: 3 },
    database: { status: 'up', latencyMs: 1.2, version: 'PostgreSQL 15.18' },
    checkedAt: '2026-12-01T00:00:00.000Z',
  };

  test('a well-formed report → returned as is', () => {
    expect(parseHealthReport(good)).toEqual(good);
  });

  test.each([
    ['null', null],
    ['a string', 'ok'],
    ['unknown status', { ...good, status: 'fine' }],
    ['database status missing', { ...good, database: {} }],
    ['server missing', { ...good, server: undefined }],
    ['checkedAt missing', { ...good, checkedAt: undefined }],
  ])('%s → null', (_label, body) => {
    expect(parseHealthReport(body)).toBeNull();
  });
});
