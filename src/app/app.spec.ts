import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';

import { App } from './app';

describe('App shell', () => {
  it('renders the product name, the health answer and the safety caution', async () => {
    TestBed.configureTestingModule({
      imports: [App],
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()],
    });
    const fixture = TestBed.createComponent(App);
    const http = TestBed.inject(HttpTestingController);
    fixture.detectChanges();
    // The health poll starts on a timer(0): let that macrotask run before expecting the request.
    await new Promise((resolve) => setTimeout(resolve, 0));
    http.expectOne('/api/health').flush({
      status: 'ok',
      server: { status: 'up', version: '0.1.0', uptimeSeconds: 1 },
      database: { status: 'up', latencyMs: 2, version: 'PostgreSQL 15.18' },
      checkedAt: '2026-12-01T00:00:00.000Z',
    });
    await fixture.whenStable();
    const text = (fixture.nativeElement as HTMLElement).textContent ?? '';
    expect(text).toContain('Rampart');
    expect(text).toContain('Database up');
    expect(text).toContain('Results are engineering estimates');
    fixture.destroy();
  });
});
