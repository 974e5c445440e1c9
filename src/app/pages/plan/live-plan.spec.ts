import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import * as Y from 'yjs';

import { readEntry } from '@rampart/collab/doc/doc-to-plan';
import { planToDoc } from '@rampart/collab/doc/plan-to-doc';

import { AuthSession } from '../../shared/auth/auth-session';
import { PlanSession } from '../../shared/plan-session/plan-session';
import { PlanSessions } from '../../shared/plan-session/plan-sessions';
import { FakeRelay } from '../../shared/plan-session/testing/fake-relay';
import { LivePlan } from './live-plan';

const PLAN_ID = '11111111-2222-4333-8444-555555555555';

function seed(relay: FakeRelay): void {
  const plan = {
    schemaVersion: 1 as const,
    name: 'Motor-drive controller board',
    nets: [{ id: 'v5' }, { id: 'v33' }],
    parts: [
      {
        id: 'R4',
        kind: 'resistor' as const,
        a: 'v5',
        b: 'v33',
        value: 100_000,
        tolerance: { percent: 1 },
      },
      { id: 'RL33', kind: 'resistor' as const, a: 'v33', b: '0', value: 33 },
    ],
    signals: [{ id: 'v33', kind: 'rail' as const, net: 'v33', nominal: 3.3 }],
    requirements: [],
  };
  Y.applyUpdate(relay.doc, Y.encodeStateAsUpdate(planToDoc(plan)));
}

describe('LivePlan', () => {
  let relay: FakeRelay;

  async function render() {
    TestBed.configureTestingModule({
      imports: [LivePlan],
      providers: [
        {
          provide: AuthSession,
          useValue: { user: signal({ id: 'u-ana', name: 'Ana Rocha', email: 'a@x.test' }) },
        },
        {
          provide: PlanSessions,
          useValue: {
            open: (planId: string, user: { id: string; name: string }) => {
              const s = new PlanSession(planId, user, relay.socket, () => null);
              void s.start().then(() => relay.connect());
              return s;
            },
          },
        },
      ],
    });
    const fixture = TestBed.createComponent(LivePlan);
    fixture.componentRef.setInput('planId', PLAN_ID);
    fixture.detectChanges();
    await fixture.whenStable();
    await new Promise((r) => setTimeout(r, 0));
    await fixture.whenStable();
    return fixture;
  }

  beforeEach(() => {
    relay = new FakeRelay();
    seed(relay);
  });

  const input = (el: HTMLElement, part: string, field: string) =>
    el.querySelector<HTMLInputElement>(`tr[data-part="${part}"] input[data-field="${field}"]`)!;

  it('synced editor → plan name, Live chip, parts with formatted values', async () => {
    const fixture = await render();
    const el: HTMLElement = fixture.nativeElement;
    expect(el.querySelector('[data-testid="plan-name"]')?.textContent).toContain(
      'Motor-drive controller board',
    );
    expect(el.querySelector('[data-testid="connection-state"]')?.textContent).toContain('Live');
    expect(input(el, 'R4', 'value').value).toBe('100 k');
    expect(input(el, 'R4', 'tolerance').value).toBe('1');
    expect(input(el, 'R4', 'value').disabled).toBe(false);
  });

  it('typing 4k7 into RL33 → stored on the relay as 4700 Ω', async () => {
    const fixture = await render();
    const field = input(fixture.nativeElement, 'RL33', 'value');
    field.value = '4k7';
    field.dispatchEvent(new Event('change'));
    await fixture.whenStable();
    expect((readEntry(relay.doc, 'parts', 'RL33') as { value: number }).value).toBe(4700);
    expect(input(fixture.nativeElement, 'RL33', 'value').value).toBe('4.7 k');
  });

  it('typing -5 into R4 → error naming part R4 shown, relay unchanged', async () => {
    const fixture = await render();
    const field = input(fixture.nativeElement, 'R4', 'value');
    field.value = '-5';
    field.dispatchEvent(new Event('change'));
    await fixture.whenStable();
    const alert = (fixture.nativeElement as HTMLElement).querySelector('[role="alert"]');
    expect(alert?.textContent).toMatch(/part R4 value/);
    expect((readEntry(relay.doc, 'parts', 'R4') as { value: number }).value).toBe(100_000);
  });

  it('viewer → read-only banner and disabled inputs', async () => {
    relay.role = 'viewer';
    const fixture = await render();
    const el: HTMLElement = fixture.nativeElement;
    expect(el.querySelector('[data-testid="read-only-banner"]')?.textContent).toContain('viewer');
    expect(input(el, 'R4', 'value').disabled).toBe(true);
    expect(el.querySelector<HTMLButtonElement>('[data-testid="undo"]')?.disabled).toBe(true);
  });

  it('edit then Ctrl+Z on the page → edit reverted on the relay', async () => {
    const fixture = await render();
    const field = input(fixture.nativeElement, 'R4', 'value');
    field.value = '150k';
    field.dispatchEvent(new Event('change'));
    await fixture.whenStable();
    document.body.dispatchEvent(
      new KeyboardEvent('keydown', { key: 'z', ctrlKey: true, bubbles: true }),
    );
    await fixture.whenStable();
    expect((readEntry(relay.doc, 'parts', 'R4') as { value: number }).value).toBe(100_000);
  });
});
