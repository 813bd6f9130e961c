import bcrypt from 'bcryptjs';

// Cost 11 in production; tests set a lower cost through the environment for speed.
const ROUNDS = Number(process.env.BCRYPT_ROUNDS ?? (process.env.NODE_ENV === 'test' ? 4 : 11));

// Compared when the e-mail is unknown, so both failures take the same time.
const DUMMY_HASH = bcrypt.hashSync('meltwire-timing-equaliser', ROUNDS);

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, ROUNDS);
}

export function verifyPassword(password: string, hash: string | null): Promise<boolean> {
  return bcrypt.compare(password, hash ?? DUMMY_HASH).then((ok) => ok && hash !== null);
}
