import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';

import type { PartRow } from './part-rows';

/** An edit typed into the parts table, before parsing. */
export interface PartFieldEdit {
  partId: string;
  field: string;
  /** `value` edits the main number, `tolerance` its ± percent. */
  column: 'value' | 'tolerance';
  text: string;
}

/**
 * The parts with their main value and tolerance, editable in place. Values accept engineering
 * input (`4k7`, `2.2u`, `10 m`); a bad entry shows its message under the field.
 */
@Component({
  selector: 'rp-parts-table',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <table data-testid="parts-table">
      <caption>
        Parts
      </caption>
      <thead>
        <tr>
          <th scope="col">Part</th>
          <th scope="col">Kind</th>
          <th scope="col">Value</th>
          <th scope="col">Tolerance ±</th>
        </tr>
      </thead>
      <tbody>
        @for (row of rows(); track row.id) {
          <tr [attr.data-part]="row.id">
            <th scope="row">
              {{ row.id }}
              @if (row.label) {
                <span class="label">{{ row.label }}</span>
              }
            </th>
            <td>{{ row.kind }}</td>
            <td>
              @if (row.field) {
                <span class="field">
                  <input
                    [value]="row.valueText"
                    [disabled]="readOnly()"
                    [attr.aria-label]="row.id + ' ' + row.field + ' in ' + row.unit"
                    [attr.aria-invalid]="!!errors()[row.id + ':value']"
                    [attr.data-field]="'value'"
                    (change)="emit(row, 'value', $event)"
                  />
                  <span class="unit">{{ row.unit }}</span>
                </span>
                @if (errors()[row.id + ':value']; as message) {
                  <span class="error" role="alert">{{ message }}</span>
                }
              } @else {
                <span class="none">—</span>
              }
            </td>
            <td>
              @if (row.toleranceRange) {
                {{ row.toleranceRange }}
              } @else if (row.field) {
                <span class="field">
                  <input
                    class="narrow"
                    [value]="row.toleranceText"
                    [disabled]="readOnly()"
                    placeholder="none"
                    [attr.aria-label]="row.id + ' tolerance in percent'"
                    [attr.aria-invalid]="!!errors()[row.id + ':tolerance']"
                    [attr.data-field]="'tolerance'"
                    (change)="emit(row, 'tolerance', $event)"
                  />
                  <span class="unit">%</span>
                </span>
                @if (errors()[row.id + ':tolerance']; as message) {
                  <span class="error" role="alert">{{ message }}</span>
                }
              } @else {
                <span class="none">—</span>
              }
            </td>
          </tr>
        }
      </tbody>
    </table>
  `,
  styles: `
    table {
      width: 100%;
      border-collapse: collapse;
      font: var(--mat-sys-body-medium);
    }
    caption {
      text-align: left;
      font: var(--mat-sys-title-medium);
      padding: 0 0 8px;
    }
    th,
    td {
      text-align: left;
      padding: 6px 8px;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
      vertical-align: top;
    }
    thead th {
      font: var(--mat-sys-label-large);
      color: var(--mat-sys-on-surface-variant);
    }
    .label {
      display: block;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    .field {
      display: inline-flex;
      align-items: center;
      gap: 4px;
    }
    input {
      width: 9ch;
      padding: 6px 8px;
      font: var(--mat-sys-body-medium);
      color: var(--mat-sys-on-surface);
      background: var(--mat-sys-surface-container-highest);
      border: 1px solid var(--mat-sys-outline);
      border-radius: 4px;
    }
    input.narrow {
      width: 6ch;
    }
    input:focus-visible {
      outline: 2px solid var(--mat-sys-primary);
      outline-offset: 1px;
    }
    input:disabled {
      color: var(--mat-sys-on-surface-variant);
      background: transparent;
      border-style: dashed;
    }
    input[aria-invalid='true'] {
      border-color: var(--rp-bad);
    }
    .error {
      display: block;
      color: var(--rp-bad);
      font: var(--mat-sys-body-small);
      max-width: 32ch;
    }
    .none {
      color: var(--mat-sys-on-surface-variant);
    }
  `,
})
export class PartsTable {
  readonly rows = input.required<readonly PartRow[]>();
  readonly readOnly = input(false);
  /** Messages keyed `<partId>:value` or `<partId>:tolerance`. */
  readonly errors = input<Readonly<Record<string, string>>>({});
  readonly edited = output<PartFieldEdit>();

  protected emit(row: PartRow, column: 'value' | 'tolerance', event: Event): void {
    if (!row.field) return;
    const text = (event.target as HTMLInputElement).value;
    this.edited.emit({ partId: row.id, field: row.field, column, text });
  }
}
