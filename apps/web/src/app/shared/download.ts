import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { firstValueFrom } from 'rxjs';

/** Fetches an authenticated file (the token travels in a header) and saves it. */
@Injectable({ providedIn: 'root' })
export class Downloader {
  private readonly http = inject(HttpClient);

  async save(url: string, filename: string): Promise<void> {
    this.saveBlob(await firstValueFrom(this.http.get(url, { responseType: 'blob' })), filename);
  }

  /** Saves text made in the browser (a CSV export) as a file. */
  saveText(text: string, filename: string, type = 'text/csv'): void {
    this.saveBlob(new Blob([text], { type }), filename);
  }

  private saveBlob(blob: Blob, filename: string): void {
    const href = URL.createObjectURL(blob);
    const a = document.createElement('a');
    a.href = href;
    a.download = filename;
    document.body.appendChild(a);
    a.click();
    a.remove();
    setTimeout(() => URL.revokeObjectURL(href), 10_000);
  }
}

/** A record's name made safe for a file name (anything but letters, digits, '.', '-' becomes '_'). */
export function safeName(name: string): string {
  return name.replace(/[^\w.-]+/g, '_');
}
