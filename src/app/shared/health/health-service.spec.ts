import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { firstValueFrom } from 'rxjs';

import { HealthService } from './health-service';

const report = {
  status: 'degraded',
  server: { status: 'up', version: '0.1.0', uptimeSeconds: 1 },
  database: { status: 'down' },
  checkedAt: '2026-12-01T00:00:00.000Z',
};

describe('HealthService', () => {
  let service: HealthService;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting()],
    });
    service = TestBed.inject(HealthService);
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  it('check() with a 200 report → report state', async () => {
    const result = firstValueFrom(service.check());
    http.expectOne('/api/health').flush({ ...report, status: 'ok', database: { status: 'up' } });
    expect(await result).toMatchObject({ kind: 'report', report: { database: { status: 'up' } } });
  });

  it('check() with a 503 carrying a report → report state with database down', async () => {
    const result = firstValueFrom(service.check());
    http.expectOne('/api/health').flush(report, { status: 503, statusText: 'Service Unavailable' });
    expect(await result).toMatchObject({
      kind: 'report',
      report: { database: { status: 'down' } },
    });
  });

  it('check() with a network error → unreachable', async () => {
    const result = firstValueFrom(service.check());
    http.expectOne('/api/health').error(new ProgressEvent('error'));
    expect(await result).toEqual({ kind: 'unreachable', message: 'Server unreachable' });
  });

  it('check() with a body that is not a report → unreachable with a clear message', async () => {
    const result = firstValueFrom(service.check());
    http.expectOne('/api/health').flush({ hello: 'world' });
    expect(await result).toEqual({
      kind: 'unreachable',
      message: 'Unexpected answer from the server',
    });
  });
});
