/** What an area seeder module (src/ops/seed/<area>.ts) exports. */
export interface DemoSignIn {
  /** e.g. "owner" — printed beside the address. */
  role: string;
  email: string;
  password: string;
}

export interface SeedModule {
  /** Idempotent: running it again changes nothing. */
  seed(): Promise<void>;
  /** Demo sign-ins printed by `npm start` (the accounts seeder exports these). */
  DEMO_SIGN_INS?: readonly DemoSignIn[];
}
