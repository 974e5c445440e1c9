import { TestBed } from '@angular/core/testing';

import { membersOfTeam } from '../../testing/account-fixtures';
import { MembersTable, sortKey } from './members-table';

describe('sortKey', () => {
  const [owner, , , viewer] = membersOfTeam();

  it('role column → owners before viewers', () => {
    expect(sortKey(owner, 'role')).toBeLessThan(sortKey(viewer, 'role') as number);
  });

  it('name column → case-blind', () => {
    expect(sortKey({ ...owner, name: 'ÉLodie' }, 'name')).toBe('élodie');
  });

  it('joinedAt column → time in ms; a bad date → 0', () => {
    expect(sortKey(owner, 'joinedAt')).toBe(Date.parse('2026-11-01T09:00:00.000Z'));
    expect(sortKey({ ...owner, joinedAt: 'not a date' }, 'joinedAt')).toBe(0);
  });
});

describe('MembersTable', () => {
  async function render(count: number) {
    TestBed.configureTestingModule({ imports: [MembersTable] });
    const fixture = TestBed.createComponent(MembersTable);
    const many = Array.from({ length: count }, (_, i) => ({
      ...membersOfTeam()[i % 4],
      userId: `u${i}`,
      name: `Member ${String(i).padStart(2, '0')}`,
    }));
    fixture.componentRef.setInput('members', many);
    await fixture.whenStable();
    return { fixture, el: fixture.nativeElement as HTMLElement };
  }

  function names(el: HTMLElement): string[] {
    return [...el.querySelectorAll('tr.mat-mdc-row td:first-child')].map(
      (td) => td.textContent?.trim() ?? '',
    );
  }

  it('23 members → first page of 10, sorted by name', async () => {
    const { el } = await render(23);
    expect(names(el)).toHaveLength(10);
    expect(names(el)[0]).toBe('Member 00');
    expect(el.textContent).toContain('1 – 10 of 23');
  });

  it('clicking the Name header → sorted descending', async () => {
    const { fixture, el } = await render(12);
    // Sorted ascending by name already (matSortActive); one click turns it to descending.
    el.querySelector<HTMLElement>('th.mat-column-name .mat-sort-header-container')!.click();
    await fixture.whenStable();
    expect(names(el)[0]).toBe('Member 11');
  });

  it('no members → the empty-state row', async () => {
    const { el } = await render(0);
    expect(el.textContent).toContain('No members to show.');
  });
});
