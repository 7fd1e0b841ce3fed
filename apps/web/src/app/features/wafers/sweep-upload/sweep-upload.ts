import {
  ChangeDetectionStrategy,
  Component,
  ElementRef,
  computed,
  effect,
  inject,
  input,
  output,
  viewChild,
} from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { DropzoneComponent, FileInputDirective, type FileInputValue } from '@ngx-dropzone/cdk';
import type { StationDto } from '@rhotrace/api-types';
import { Caution } from '../../../shared/caution';
import { Icon } from '../../../shared/icon';
import { UploadFile } from './upload-file';
import { UploadStore } from './upload-store';
import { SkipTarget, focusPlace } from '../../../shared/skip-target';

/**
 * Bringing sweeps in: drop or pick files; each is checked by the server with its own method,
 * station, mapping and geometry (preset from what was detected) and stored once nothing blocks
 * it, with a progress bar.
 */
@Component({
  selector: 'rt-sweep-upload',
  imports: [
    SkipTarget,
    MatButtonModule,
    DropzoneComponent,
    FileInputDirective,
    Caution,
    Icon,
    UploadFile,
  ],
  providers: [UploadStore],
  templateUrl: './sweep-upload.html',
  styleUrl: './sweep-upload.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SweepUpload {
  protected readonly store = inject(UploadStore);

  readonly waferId = input.required<number>();
  readonly material = input<string | null>(null);
  readonly stations = input<StationDto[]>([]);
  /** Emits the id of each sweep stored. */
  readonly stored = output<number>();
  /**
   * Store is disabled while nothing is ready or a file is still being read, checked or sent,
   * but keeps the keyboard focus (Material's `disabledInteractive`): a button disabled under
   * the focus drops it to the page, and the next Enter does nothing.
   */
  protected readonly storeDisabled = computed(
    () => this.store.ready().length === 0 || this.store.busy(),
  );
  private readonly storeButton = viewChild('storeButton', { read: ElementRef<HTMLElement> });

  constructor() {
    effect(() => this.store.waferId.set(this.waferId()));
    this.store.stored.pipe(takeUntilDestroyed()).subscribe((id) => this.stored.emit(id));
  }

  /** Takes newly chosen or dropped files and checks each. */
  protected addFiles(value: FileInputValue): void {
    this.store.add(value === null ? [] : Array.isArray(value) ? value : [value]);
  }

  /**
   * A click anywhere on the drop zone opens the file chooser (the zone itself only listens to
   * Enter and drops). The click the chooser's own input sends bubbles back here and is ignored.
   */
  protected openChooser(event: Event, zone: DropzoneComponent): void {
    if (event.target instanceof HTMLInputElement) return;
    event.preventDefault();
    zone.openFilePicker();
  }

  protected storeIfAllowed(): void {
    if (!this.storeDisabled()) this.store.storeReady();
  }

  /** The skip link past the files' checks: straight to Store. */
  protected skipToStore(event: Event): void {
    event.preventDefault();
    const button = this.storeButton()?.nativeElement;
    if (button) focusPlace(button);
  }
}
