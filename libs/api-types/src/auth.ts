/** Roles, from most to least privileged. Technicians and students share `technician`. */
export const ROLES = ['admin', 'manager', 'engineer', 'physicist', 'technician'] as const;
export type Role = (typeof ROLES)[number];

/** A user as the API shows it (never the password hash). */
export interface UserDto {
  id: number;
  email: string;
  name: string;
  role: Role;
  active: boolean;
  createdAt: string;
  updatedAt: string;
}

/** The signed-in user carried in a session. */
export interface SessionUser {
  id: number;
  email: string;
  name: string;
  role: Role;
}

export interface LoginRequest {
  email: string;
  password: string;
}

export interface LoginResponse {
  token: string;
  /** ISO time at which `token` stops working; renew with `POST /api/auth/refresh` before then. */
  expiresAt: string;
  user: SessionUser;
}

export interface PasswordResetRequest {
  email: string;
}

export interface PasswordResetConfirm {
  token: string;
  password: string;
}

export interface CreateUserRequest {
  email: string;
  name: string;
  role: Role;
  password: string;
}

export interface UpdateUserRequest {
  name?: string;
  role?: Role;
  active?: boolean;
  password?: string;
  /** With `active: false`: the account that takes over the person's open tasks. */
  reassignTo?: number;
}

/** `POST /api/auth/password-reset` always answers 202 with this, whether or not the account exists. */
export interface PasswordResetAccepted {
  message: string;
}

/** Shortest password the API accepts (sign-up by an admin, reset, change). */
export const MIN_PASSWORD_LENGTH = 10;

/** Fields `GET /api/users` sorts by (`sort=name`, `sort=-createdAt`). */
export const USER_SORT_FIELDS = ['name', 'email', 'role', 'createdAt'] as const;

/** `GET /api/users` query: `q` searches name and e-mail. */
export interface UserListQuery {
  page?: number;
  pageSize?: number;
  sort?: string;
  q?: string;
  role?: Role;
  active?: 'true' | 'false';
}

/** An active account that can be given an assignment (`GET /api/users/assignees`). */
export interface AssigneeDto {
  id: number;
  name: string;
  email: string;
  role: Role;
}
