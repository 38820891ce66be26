// better-auth's database adapter over our Sequelize models, so the sign-in tables live in the same schema,
// migrations and transactions as everything else (see migrations/0001-auth-tables.ts).
import { Op, type ModelStatic, type Model, type Transaction, type WhereOptions } from 'sequelize';
import { createAdapterFactory, type CleanedWhere } from '@better-auth/core/db/adapter';
import { sequelize } from './db';
import { authModels } from '@/server/models';

type AnyModel = ModelStatic<Model>;

function modelFor(name: string): AnyModel {
  const model = (authModels as Record<string, AnyModel>)[name];
  if (!model) throw new Error(`no Sequelize model for better-auth model "${name}"`);
  return model;
}

const likeEscape = (value: unknown) => String(value).replace(/[\\%_]/g, (c) => `\\${c}`);

function condition(clause: CleanedWhere): WhereOptions {
  const { field, value, operator } = clause;
  switch (operator) {
    case 'eq':
      return { [field]: value === null ? { [Op.is]: null } : { [Op.eq]: value } };
    case 'ne':
      return { [field]: value === null ? { [Op.not]: null } : { [Op.ne]: value } };
    case 'lt':
      return { [field]: { [Op.lt]: value } };
    case 'lte':
      return { [field]: { [Op.lte]: value } };
    case 'gt':
      return { [field]: { [Op.gt]: value } };
    case 'gte':
      return { [field]: { [Op.gte]: value } };
    case 'in':
      return { [field]: { [Op.in]: value as unknown[] } };
    case 'not_in':
      return { [field]: { [Op.notIn]: value as unknown[] } };
    case 'contains':
      return { [field]: { [Op.like]: `%${likeEscape(value)}%` } };
    case 'starts_with':
      return { [field]: { [Op.like]: `${likeEscape(value)}%` } };
    case 'ends_with':
      return { [field]: { [Op.like]: `%${likeEscape(value)}` } };
    default:
      throw new Error(`unsupported where operator "${operator as string}"`);
  }
}

/** AND clauses all hold, and at least one OR clause holds when there are any (as better-auth's SQL adapters do). */
export function toSequelizeWhere(where: CleanedWhere[] | undefined): WhereOptions {
  if (!where?.length) return {};
  const all = where.filter((w) => w.connector !== 'OR').map(condition);
  const any = where.filter((w) => w.connector === 'OR').map(condition);
  if (any.length) all.push({ [Op.or]: any });
  return { [Op.and]: all };
}

const plain = (row: Model | null) => (row ? (row.get({ plain: true }) as Record<string, unknown>) : null);

function buildAdapter(transaction: Transaction | undefined): ReturnType<typeof createAdapterFactory> {
  return createAdapterFactory({
    config: {
      adapterId: 'tactus-sequelize',
      adapterName: 'Tactus Sequelize adapter',
      usePlural: false,
      supportsJSON: false,
      supportsDates: true,
      supportsBooleans: true,
      supportsNumericIds: false,
      transaction: transaction
        ? false
        : (callback) => sequelize.transaction((t) => callback(buildAdapter(t)(latestOptions!))),
    },
    adapter: () => ({
      async create({ model, data }) {
        const row = await modelFor(model).create(data as Record<string, unknown>, { transaction });
        return plain(row) as never;
      },
      async findOne({ model, where, select }) {
        const row = await modelFor(model).findOne({
          where: toSequelizeWhere(where),
          attributes: select?.length ? select : undefined,
          transaction,
        });
        return plain(row) as never;
      },
      async findMany({ model, where, limit, offset, sortBy, select }) {
        const rows = await modelFor(model).findAll({
          where: toSequelizeWhere(where),
          limit,
          offset,
          order: sortBy ? [[sortBy.field, sortBy.direction.toUpperCase()]] : undefined,
          attributes: select?.length ? select : undefined,
          transaction,
        });
        return rows.map(plain) as never;
      },
      async count({ model, where }) {
        return modelFor(model).count({ where: toSequelizeWhere(where), transaction });
      },
      async update({ model, where, update }) {
        const row = await modelFor(model).findOne({ where: toSequelizeWhere(where), transaction });
        if (!row) return null;
        await row.update(update as Record<string, unknown>, { transaction });
        return plain(row) as never;
      },
      async updateMany({ model, where, update }) {
        const [count] = await modelFor(model).update(update as Record<string, unknown>, {
          where: toSequelizeWhere(where),
          transaction,
        });
        return count;
      },
      async delete({ model, where }) {
        await modelFor(model).destroy({ where: toSequelizeWhere(where), transaction });
      },
      async deleteMany({ model, where }) {
        return modelFor(model).destroy({ where: toSequelizeWhere(where), transaction });
      },
      // Single-use tokens: lock the row, delete it, hand it back — at most one caller ever gets it.
      async consumeOne({ model, where }) {
        const run = async (t: Transaction) => {
          const row = await modelFor(model).findOne({
            where: toSequelizeWhere(where),
            transaction: t,
            lock: t.LOCK.UPDATE,
          });
          if (!row) return null;
          await row.destroy({ transaction: t });
          return plain(row);
        };
        return (transaction ? run(transaction) : sequelize.transaction(run)) as never;
      },
      async incrementOne({ model, where, increment, set }) {
        const run = async (t: Transaction) => {
          const row = await modelFor(model).findOne({
            where: toSequelizeWhere(where),
            transaction: t,
            lock: t.LOCK.UPDATE,
          });
          if (!row) return null;
          const values: Record<string, unknown> = { ...(set ?? {}) };
          for (const [field, delta] of Object.entries(increment)) values[field] = (Number(row.get(field)) || 0) + delta;
          await row.update(values, { transaction: t });
          return plain(row);
        };
        return (transaction ? run(transaction) : sequelize.transaction(run)) as never;
      },
    }),
  });
}

// The factory hands its options to the adapter on first use; transactions reuse them.
let latestOptions: Parameters<ReturnType<typeof createAdapterFactory>>[0] | undefined;

export function sequelizeAdapter() {
  const root = buildAdapter(undefined);
  return (options: Parameters<typeof root>[0]) => {
    latestOptions = options;
    return root(options);
  };
}
