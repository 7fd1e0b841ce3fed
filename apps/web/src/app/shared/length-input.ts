import { Directive, ElementRef, forwardRef, inject, input } from '@angular/core';
import { type ControlValueAccessor, NG_VALUE_ACCESSOR } from '@angular/forms';
import { cmToLength, lengthToCm } from '@rhotrace/api-types';
import { lengthUnitOf } from './format';

/**
 * A number field that shows and takes a stored length (cm) in the unit a lab reads that field in:
 * `<input matInput type="number" rtLength="thicknessCm" formControlName="thicknessCm">` shows
 * 0.0525 as 525 (µm) and stores 525 typed as 0.0525. The form's value, validators and the API
 * keep centimetres; pair it with `<span matTextSuffix>{{ unit }}</span>` from `lengthUnitOf`.
 */
@Directive({
  selector: 'input[rtLength]',
  providers: [
    { provide: NG_VALUE_ACCESSOR, useExisting: forwardRef(() => LengthInput), multi: true },
  ],
  host: { '(input)': 'typed()', '(blur)': 'touched()' },
})
export class LengthInput implements ControlValueAccessor {
  private readonly element = inject<ElementRef<HTMLInputElement>>(ElementRef).nativeElement;
  /** The stored field's name (`thicknessCm`), which decides the unit shown. */
  readonly rtLength = input.required<string>();
  private changed: (valueCm: number | null) => void = () => undefined;
  protected touched: () => void = () => undefined;

  writeValue(valueCm: number | null | undefined): void {
    const shown =
      valueCm === null || valueCm === undefined || !Number.isFinite(valueCm)
        ? ''
        : String(cmToLength(valueCm, lengthUnitOf(this.rtLength())));
    // Rewriting the text while it is being typed ("0." in progress) would lose the cursor.
    if (this.read() !== (valueCm ?? null)) this.element.value = shown;
  }

  registerOnChange(fn: (valueCm: number | null) => void): void {
    this.changed = fn;
  }

  registerOnTouched(fn: () => void): void {
    this.touched = fn;
  }

  setDisabledState(disabled: boolean): void {
    this.element.disabled = disabled;
  }

  protected typed(): void {
    this.changed(this.read());
  }

  /** The typed text in centimetres; null when empty, NaN when not a number (validators say so). */
  private read(): number | null {
    const text = this.element.value.trim();
    if (text === '') return null;
    const n = Number(text);
    return Number.isFinite(n) ? lengthToCm(n, lengthUnitOf(this.rtLength())) : Number.NaN;
  }
}
