import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { SweepMapInput } from '@rhotrace/api-types';
import { SITE_PATTERN_IDS } from '@rhotrace/physics';
import type { UploadItem } from './upload-item';
import { UploadStore } from './upload-store';

/**
 * A file's wafer-map fields (the pattern its numbered sites follow, the edge exclusion), shown
 * only when its columns place readings at sites; each change checks the file again.
 */
@Component({
  selector: 'rt-upload-map-fields',
  imports: [MatFormFieldModule, MatInputModule, MatSelectModule],
  templateUrl: './upload-map-fields.html',
  styleUrl: './sweep-upload.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UploadMapFields {
  private readonly store = inject(UploadStore);

  readonly item = input.required<UploadItem>();

  protected readonly sitePatterns = SITE_PATTERN_IDS;
  /** True when the file's columns place readings at sites (it is stored as a wafer map). */
  protected readonly hasSites = computed(() =>
    this.item().columns.some((c) => c.meaning === 'site' || c.meaning === 'site-x'),
  );

  protected setMap(change: SweepMapInput): void {
    const map = { ...this.item().choices.map, ...change };
    this.store.choose(this.item().key, { map });
  }

  protected setEdgeExclusion(raw: string): void {
    this.setMap({ edgeExclusionMm: raw.trim() === '' ? undefined : Number(raw) });
  }
}
