// People: the verbs routes use instead of the User model. Addresses are stored trimmed and
// lower-cased, so look-ups are exact.
import { UniqueConstraintError } from 'sequelize';
import { models } from './models';

export interface UserRecord {
	id: string;
	email: string;
	name: string;
	createdAt: Date;
}

const plain = (u: { id: string; email: string; name: string; createdAt: Date }): UserRecord => ({
	id: u.id,
	email: u.email,
	name: u.name,
	createdAt: u.createdAt
});

export const normalizeEmail = (email: string) => email.trim().toLowerCase();

export class EmailTaken extends Error {
	constructor() {
		super('An account with this e-mail address already exists');
	}
}

export async function createUser(input: { email: string; name: string; passwordHash: string }): Promise<UserRecord> {
	try {
		return plain(await models().User.create({ ...input, email: normalizeEmail(input.email) }));
	} catch (e) {
		if (e instanceof UniqueConstraintError) throw new EmailTaken();
		throw e;
	}
}

export async function getUser(id: string): Promise<UserRecord | null> {
	const user = await models().User.findByPk(id);
	return user && plain(user);
}

export async function findUserByEmail(email: string): Promise<UserRecord | null> {
	const user = await models().User.findOne({ where: { email: normalizeEmail(email) } });
	return user && plain(user);
}

/** The stored argon2id hash, for sign-in and password change only. */
export async function getPasswordHash(userId: string): Promise<string | null> {
	const user = await models().User.findByPk(userId, { attributes: ['id', 'passwordHash'] });
	return user?.passwordHash ?? null;
}

export async function findUserWithHashByEmail(email: string) {
	const user = await models().User.findOne({ where: { email: normalizeEmail(email) } });
	return user && { ...plain(user), passwordHash: user.passwordHash };
}

export async function renameUser(userId: string, name: string): Promise<void> {
	await models().User.update({ name }, { where: { id: userId } });
}

export async function setPasswordHash(userId: string, passwordHash: string): Promise<void> {
	await models().User.update({ passwordHash }, { where: { id: userId } });
}
