// Placeholder: filled in by the work that owns this migration.
import type { QueryInterface } from 'sequelize';

export async function up(_params: { context: QueryInterface }) {}

export async function down(_params: { context: QueryInterface }) {}
