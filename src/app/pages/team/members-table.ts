import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  input,
  output,
  viewChild,
} from '@angular/core';
import { DatePipe } from '@angular/common';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginator, MatPaginatorModule } from '@angular/material/paginator';
import { MatSelectModule } from '@angular/material/select';
import { MatSort, MatSortModule } from '@angular/material/sort';
import { MatTableDataSource, MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';

import { ROLES, type MemberDto, type Role } from '@rampart/collab/api/accounts';

import { ROLE_HINTS, ROLE_LABELS } from '../../shared/teams/team-abilities';

/** A role change the user picked in the table. */
export interface RoleChoice {
  member: MemberDto;
  role: Role;
}

/** Sort rank of roles: owners first, like the order in `ROLES`. */
const ROLE_RANK: Record<Role, number> = { owner: 0, editor: 1, reviewer: 2, viewer: 3 };

/**
 * The members of a team: sortable by every column, paged. Owners (`canManage`) get a role
 * select and a remove button per row; everyone else sees the role as words. Changes are only
 * *asked for* here (outputs); the page sends them and reloads.
 */
@Component({
  selector: 'rp-members-table',
  imports: [
    DatePipe,
    MatButtonModule,
    MatIconModule,
    MatPaginatorModule,
    MatSelectModule,
    MatSortModule,
    MatTableModule,
    MatTooltipModule,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div class="frame">
      <table
        mat-table
        [dataSource]="dataSource"
        matSort
        matSortActive="name"
        matSortDirection="asc"
        aria-label="Team members"
        data-testid="members-table"
      >
        <ng-container matColumnDef="name">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>Name</th>
          <td mat-cell *matCellDef="let m">
            {{ m.name }}
            @if (m.userId === selfId()) {
              <span class="you">(you)</span>
            }
          </td>
        </ng-container>
        <ng-container matColumnDef="email">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>E-mail</th>
          <td mat-cell *matCellDef="let m">{{ m.email }}</td>
        </ng-container>
        <ng-container matColumnDef="role">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>Role</th>
          <td mat-cell *matCellDef="let m">
            @if (canManage()) {
              <mat-select
                class="role-select"
                [value]="m.role"
                [disabled]="busy()"
                [aria-label]="'Role of ' + m.name"
                (selectionChange)="roleChange.emit({ member: m, role: $event.value })"
              >
                @for (r of roles; track r) {
                  <mat-option [value]="r">{{ labels[r] }}</mat-option>
                }
              </mat-select>
            } @else {
              <span [matTooltip]="hints[asRole(m.role)]">{{ labels[asRole(m.role)] }}</span>
            }
          </td>
        </ng-container>
        <ng-container matColumnDef="joinedAt">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>Joined</th>
          <td mat-cell *matCellDef="let m">{{ m.joinedAt | date: 'mediumDate' }}</td>
        </ng-container>
        <ng-container matColumnDef="actions">
          <th mat-header-cell *matHeaderCellDef>
            <span class="cdk-visually-hidden">Actions</span>
          </th>
          <td mat-cell *matCellDef="let m">
            @if (m.userId !== selfId()) {
              <button
                matIconButton
                type="button"
                [disabled]="busy()"
                [attr.aria-label]="'Remove ' + m.name + ' from the team'"
                [matTooltip]="'Remove ' + m.name"
                (click)="remove.emit(m)"
              >
                <mat-icon>person_remove</mat-icon>
              </button>
            }
          </td>
        </ng-container>

        <tr mat-header-row *matHeaderRowDef="columns()"></tr>
        <tr mat-row *matRowDef="let row; columns: columns()"></tr>
        <tr class="mat-mdc-row" *matNoDataRow>
          <td class="mat-mdc-cell empty" [attr.colspan]="columns().length">No members to show.</td>
        </tr>
      </table>
      <mat-paginator
        [pageSize]="10"
        [pageSizeOptions]="[10, 25, 50]"
        [hidePageSize]="members().length <= 10"
        aria-label="Pages of members"
      />
    </div>
  `,
  styles: `
    .frame {
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: 12px;
      overflow: auto;
    }
    table {
      width: 100%;
    }
    .you {
      color: var(--mat-sys-on-surface-variant);
      margin-left: 4px;
    }
    .role-select {
      max-width: 140px;
    }
    .empty {
      padding: 16px;
      color: var(--mat-sys-on-surface-variant);
    }
  `,
})
export class MembersTable {
  /** Members as the server sent them; the table sorts and pages a copy. */
  readonly members = input.required<readonly MemberDto[]>();
  /** Whether to show the role select and remove buttons (owners). */
  readonly canManage = input(false);
  /** The signed-in user's id, so their own row says "(you)" and has no remove button. */
  readonly selfId = input<string | null>(null);
  /** While a change is being sent: the controls are disabled. */
  readonly busy = input(false);

  readonly roleChange = output<RoleChoice>();
  readonly remove = output<MemberDto>();

  protected readonly roles = ROLES;
  protected readonly labels = ROLE_LABELS;
  protected readonly hints = ROLE_HINTS;
  protected readonly columns = computed(() =>
    this.canManage()
      ? ['name', 'email', 'role', 'joinedAt', 'actions']
      : ['name', 'email', 'role', 'joinedAt'],
  );
  protected readonly dataSource = new MatTableDataSource<MemberDto>([]);

  private readonly _sort = viewChild.required(MatSort);
  private readonly _paginator = viewChild.required(MatPaginator);

  constructor() {
    this.dataSource.sortingDataAccessor = sortKey;
    effect(() => {
      this.dataSource.data = [...this.members()];
    });
    effect(() => {
      this.dataSource.sort = this._sort();
      this.dataSource.paginator = this._paginator();
    });
  }

  /** Template helper: the row type of `*matCellDef` is untyped. */
  protected asRole(value: unknown): Role {
    return ROLES.includes(value as Role) ? (value as Role) : 'viewer';
  }
}

/** What each column sorts by: names case-blind, roles by rank, dates by time. */
export function sortKey(m: MemberDto, column: string): string | number {
  switch (column) {
    case 'name':
      return m.name.toLocaleLowerCase();
    case 'email':
      return m.email.toLocaleLowerCase();
    case 'role':
      return ROLE_RANK[m.role] ?? ROLES.length;
    case 'joinedAt':
      return Date.parse(m.joinedAt) || 0;
    default:
      return '';
  }
}
