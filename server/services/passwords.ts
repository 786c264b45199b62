import bcrypt from "bcryptjs";

/**
 * bcrypt cost 11: about a quarter of a second per hash with bcryptjs here (measured); OWASP asks
 * for at least 10 (Password Storage Cheat Sheet). Tests use 4 to stay fast.
 */
const COST = process.env.NODE_ENV === "test" ? 4 : 11;

export const hashPassword = (password: string) => bcrypt.hash(password, COST);

// A real hash of a random string, compared when the e-mail is unknown, so "no such user" and
// "wrong password" take the same time and get the same answer.
const DUMMY_HASH = bcrypt.hashSync("rhomb-no-such-user-" + Math.random(), COST);

/** Compares in constant work whether or not there is a stored hash. */
export const passwordMatches = (password: string, hash: string | undefined) => bcrypt.compare(password, hash ?? DUMMY_HASH);
