import { Op, type WhereOptions } from 'sequelize';
import type { Customer as CustomerDto, CustomerListQuery, CustomerPatch } from '../../../shared/api/customers';
import { Customer, Job } from '../../db/models';
import { ConflictError, NotFoundError } from '../../lib/errors';
import type { SessionUser } from '../../types';

type CustomerInput = { name: string; email: string; phone: string; address: { line1: string; line2: string; town: string; postcode: string } };

export function toCustomerDto(c: Customer): CustomerDto {
  return {
    id: c.id,
    name: c.name,
    email: c.email,
    phone: c.phone,
    address: { line1: c.addressLine1, line2: c.addressLine2, town: c.town, postcode: c.postcode },
    createdAt: c.createdAt.toISOString(),
  };
}

function columns(body: Partial<CustomerInput>) {
  const { address, ...rest } = body;
  return {
    ...rest,
    ...(address ? { addressLine1: address.line1, addressLine2: address.line2 ?? '', town: address.town, postcode: address.postcode } : {}),
  };
}

/** Escapes LIKE wildcards so a search for "50%" means the characters, not a pattern. */
export function likePattern(q: string) {
  return `%${q.replace(/[\\%_]/g, (ch) => `\\${ch}`)}%`;
}

/** Scoped to the actor's company: another company's id is "not found". */
export async function findCustomerInOrg(actor: SessionUser, id: string): Promise<Customer> {
  const c = await Customer.findOne({ where: { id, organisationId: actor.organisationId } });
  if (!c) throw new NotFoundError('customer');
  return c;
}

export function createCustomersService() {
  return {
    async list(actor: SessionUser, query: CustomerListQuery): Promise<CustomerDto[]> {
      const where: WhereOptions = { organisationId: actor.organisationId };
      if (query.q?.trim()) {
        const p = likePattern(query.q.trim());
        Object.assign(where, {
          [Op.or]: [
            { name: { [Op.iLike]: p } },
            { email: { [Op.iLike]: p } },
            { postcode: { [Op.iLike]: p } },
            { town: { [Op.iLike]: p } },
            { addressLine1: { [Op.iLike]: p } },
          ],
        });
      }
      const rows = await Customer.findAll({ where, order: [['name', 'ASC']], limit: 500 });
      return rows.map(toCustomerDto);
    },

    async get(actor: SessionUser, id: string) {
      return toCustomerDto(await findCustomerInOrg(actor, id));
    },

    async create(actor: SessionUser, body: CustomerInput) {
      const c = await Customer.create({ organisationId: actor.organisationId, ...columns(body) } as never);
      return toCustomerDto(c);
    },

    async update(actor: SessionUser, id: string, patch: CustomerPatch) {
      const c = await findCustomerInOrg(actor, id);
      await c.update(columns(patch as Partial<CustomerInput>));
      return toCustomerDto(c);
    },

    async remove(actor: SessionUser, id: string) {
      const c = await findCustomerInOrg(actor, id);
      const jobs = await Job.count({ where: { customerId: c.id } });
      if (jobs > 0) throw new ConflictError(`this customer has ${jobs} job(s); remove or move them first`, 'customer_has_jobs');
      await c.destroy();
    },
  };
}
