import { Injectable, computed, signal } from '@angular/core';
import {
  roleCan,
  type Capability,
  type LoginResponse,
  type Role,
  type SessionUser,
} from '@rhotrace/api-types';

const STORAGE_KEY = 'rhotrace.session';

interface StoredSession {
  token: string;
  expiresAt: string;
  user: SessionUser;
}

function readStored(): StoredSession | null {
  try {
    const raw = globalThis.sessionStorage?.getItem(STORAGE_KEY);
    if (!raw) return null;
    const parsed = JSON.parse(raw) as StoredSession;
    if (!parsed.token || Date.parse(parsed.expiresAt) <= Date.now()) return null;
    return parsed;
  } catch {
    return null;
  }
}

/** The signed-in user and token; kept in sessionStorage so a reload keeps the session. */
@Injectable({ providedIn: 'root' })
export class Session {
  private readonly state = signal<StoredSession | null>(readStored());

  readonly user = computed(() => this.state()?.user ?? null);
  readonly token = computed(() => this.state()?.token ?? null);
  readonly role = computed<Role | null>(() => this.state()?.user.role ?? null);
  readonly signedIn = computed(() => this.state() !== null);

  start(response: LoginResponse): void {
    const stored: StoredSession = {
      token: response.token,
      expiresAt: response.expiresAt,
      user: response.user,
    };
    this.state.set(stored);
    globalThis.sessionStorage?.setItem(STORAGE_KEY, JSON.stringify(stored));
  }

  end(): void {
    this.state.set(null);
    globalThis.sessionStorage?.removeItem(STORAGE_KEY);
  }

  /** True when the signed-in user's role has `capability` in the role-to-capability table. */
  can(capability: Capability): boolean {
    return roleCan(this.role(), capability);
  }

  /** Milliseconds until the token expires (negative when expired). */
  msUntilExpiry(): number {
    const s = this.state();
    return s ? Date.parse(s.expiresAt) - Date.now() : -1;
  }
}
