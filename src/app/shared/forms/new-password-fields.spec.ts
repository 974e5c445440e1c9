import { ChangeDetectionStrategy, Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';

import { NEW_PASSWORD_VALIDATORS, matchesSibling } from './field-message';
import { NewPasswordFields } from './new-password-fields';

@Component({
  imports: [ReactiveFormsModule, NewPasswordFields],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `<form [formGroup]="form"><rp-new-password-fields label="Password" /></form>`,
})
class Host {
  readonly form = new FormGroup({
    password: new FormControl('', { nonNullable: true, validators: [...NEW_PASSWORD_VALIDATORS] }),
    repeat: new FormControl('', {
      nonNullable: true,
      validators: [Validators.required, matchesSibling('password')],
    }),
  });
}

@Component({
  imports: [ReactiveFormsModule, NewPasswordFields],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `<form [formGroup]="form"><rp-new-password-fields /></form>`,
})
class HostWithoutRepeat {
  readonly form = new FormGroup({ password: new FormControl('') });
}

describe('NewPasswordFields', () => {
  it('labels from `label`; both inputs bound to the page form; repeat re-checked when the password changes', async () => {
    const fixture = TestBed.createComponent(Host);
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    const labels = [...el.querySelectorAll('mat-label')].map((l) => l.textContent?.trim());
    expect(labels).toEqual(['Password', 'Repeat password']);
    const input = (name: string) =>
      el.querySelector<HTMLInputElement>(`input[formcontrolname=${name}]`)!;
    input('password').value = 'first-password';
    input('password').dispatchEvent(new Event('input'));
    input('repeat').value = 'first-password';
    input('repeat').dispatchEvent(new Event('input'));
    const { repeat } = fixture.componentInstance.form.controls;
    expect(repeat.valid).toBe(true);
    // Changing the first field must invalidate the repetition without touching it.
    input('password').value = 'second-password';
    input('password').dispatchEvent(new Event('input'));
    expect(repeat.errors).toEqual({ mismatch: true });
  });

  it('form without the repeat control → error naming the missing control', () => {
    expect(() => TestBed.createComponent(HostWithoutRepeat).detectChanges()).toThrow(
      "rp-new-password-fields: the form has no control 'repeat'",
    );
  });
});
