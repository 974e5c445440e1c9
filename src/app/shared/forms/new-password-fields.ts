import { ChangeDetectionStrategy, Component, OnInit, computed, inject, input } from '@angular/core';
import { AbstractControl, ControlContainer, ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';

import { PASSWORD_MIN_LENGTH, fieldMessage, revalidateOn } from './field-message';

/**
 * A new password and its repetition, inside the enclosing reactive form: the two controls
 * (`passwordName`, `repeatName`) belong to the page's form group, which sets their validators
 * (`NEW_PASSWORD_VALIDATORS`, `matchesSibling`). This component lays out the fields, their
 * messages, and re-validates the repetition when the password changes.
 */
@Component({
  selector: 'rp-new-password-fields',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  // The fields' `formControlName`s resolve against the page's form, not a group of their own.
  // The inputs also carry the control name as attributes, as a static `formControlName` would.
  viewProviders: [
    { provide: ControlContainer, useFactory: () => inject(ControlContainer, { skipSelf: true }) },
  ],
  template: `
    <mat-form-field>
      <mat-label>{{ label() }}</mat-label>
      <input
        matInput
        [formControlName]="passwordName()"
        [attr.formcontrolname]="passwordName()"
        [attr.name]="passwordName()"
        type="password"
        autocomplete="new-password"
      />
      <mat-hint>At least {{ minLength }} characters</mat-hint>
      <mat-error>{{ message(passwordName(), label()) }}</mat-error>
    </mat-form-field>
    <mat-form-field>
      <mat-label>{{ repeatLabel() }}</mat-label>
      <input
        matInput
        [formControlName]="repeatName()"
        [attr.formcontrolname]="repeatName()"
        [attr.name]="repeatName()"
        type="password"
        autocomplete="new-password"
      />
      <mat-error>{{ message(repeatName(), 'Repeated password') }}</mat-error>
    </mat-form-field>
  `,
  styles: `
    :host {
      display: contents;
    }
    mat-form-field {
      width: 100%;
    }
  `,
})
export class NewPasswordFields implements OnInit {
  private readonly _container = inject(ControlContainer);

  /** Label of the first field ("New password", or "Password" when creating an account). */
  readonly label = input('New password');
  /** Name of the password control in the enclosing form group. */
  readonly passwordName = input('password');
  /** Name of the repetition control in the enclosing form group. */
  readonly repeatName = input('repeat');

  protected readonly minLength = PASSWORD_MIN_LENGTH;
  protected readonly repeatLabel = computed(() => `Repeat ${this.label().toLowerCase()}`);

  ngOnInit(): void {
    revalidateOn(this._control(this.passwordName()), this._control(this.repeatName()));
  }

  protected message(name: string, label: string): string {
    return fieldMessage(this._control(name), label);
  }

  private _control(name: string): AbstractControl {
    const control = this._container.control?.get(name);
    if (!control) throw new Error(`rp-new-password-fields: the form has no control '${name}'`);
    return control;
  }
}
