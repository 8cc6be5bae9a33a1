import bcrypt from "bcryptjs";

export const MIN_PASSWORD_LENGTH = 10;
const BCRYPT_ROUNDS = 10;

export function passwordProblem(password: unknown): string | null {
  if (typeof password !== "string") return "password is required";
  if (password.length < MIN_PASSWORD_LENGTH) return `password must have at least ${MIN_PASSWORD_LENGTH} characters`;
  if (password.length > 200) return "password must have at most 200 characters";
  return null;
}

export const hashPassword = (password: string) => bcrypt.hash(password, BCRYPT_ROUNDS);
export const checkPassword = (password: string, hash: string) => bcrypt.compare(password, hash);
