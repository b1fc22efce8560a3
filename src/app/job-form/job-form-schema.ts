import { z } from 'zod';
import { addressSchema, customerBodySchema } from '../../../shared/api/customers';
import { jobBodySchema, type JobStage } from '../../../shared/api/jobs';
import type { AddressValues } from '../../components/forms/address-fields';
import { emptyAddress, addressValues } from '../../components/forms/address-fields';
import { emptyCustomer, type CustomerValues } from '../../features/customers/components/customer-fields';
import type { Job } from '../../../shared/api/jobs';

export type CustomerMode = 'existing' | 'new';

/** The job form as typed: the customer (chosen or new), then the job's own fields named as the API names them. */
export type JobFormValues = {
  mode: CustomerMode;
  customerId: string;
  customer: CustomerValues;
  /** A new customer's address is also the property's. */
  sameAddress: boolean;
  propertyAddress: AddressValues;
  stage: JobStage;
  assignedInstallerId: string;
  installDate: string;
  accessNotes: string;
  notes: string;
};

export const newJobValues = (): JobFormValues => ({
  mode: 'new',
  customerId: '',
  customer: emptyCustomer(),
  sameAddress: true,
  propertyAddress: emptyAddress(),
  stage: 'enquiry',
  assignedInstallerId: '',
  installDate: '',
  accessNotes: '',
  notes: '',
});

export const jobFormValues = (job: Job): JobFormValues => ({
  ...newJobValues(),
  mode: 'existing',
  customerId: job.customer.id,
  sameAddress: false,
  propertyAddress: addressValues(job.propertyAddress),
  stage: job.stage,
  assignedInstallerId: job.assignedInstaller?.id ?? '',
  installDate: job.installDate ? job.installDate.slice(0, 10) : '',
  accessNotes: job.accessNotes ?? '',
  notes: job.notes ?? '',
});

type JobBodyOut = z.output<typeof jobBodySchema>;
/** What a checked form gives: the new customer's body (if any) and the job's body less the customer's id. */
export type JobFormOutput = { customer: z.output<typeof customerBodySchema> | null; customerId: string | null; job: Omit<JobBodyOut, 'customerId'> };

const shape = jobBodySchema.shape;
const unused = z.unknown().transform(() => undefined);
/** A select or date left blank is the API's null ("not assigned", "no date"). */
const blankIsNull = <T extends z.ZodType>(api: T) =>
  z
    .string()
    .transform((v) => (v === '' ? null : v))
    .pipe(api as unknown as z.ZodType<z.output<T>, string | null>);

/**
 * The job form's checks, from the API's own customer and job schemas. Which parts apply follows the
 * form: a new customer is checked with customerBodySchema (and its address reused for the property
 * when ticked), an existing one by its id; installer and date only for roles that assign them.
 */
export function jobFormSchema(values: Pick<JobFormValues, 'mode' | 'sameAddress'>, opts: { canAssign: boolean }): z.ZodType<JobFormOutput, JobFormValues> {
  const isNew = values.mode === 'new';
  const reuseAddress = isNew && values.sameAddress;
  return z
    .object({
      mode: z.enum(['existing', 'new']),
      sameAddress: z.boolean(),
      customer: isNew ? customerBodySchema : unused,
      customerId: isNew ? unused : shape.customerId,
      propertyAddress: reuseAddress ? unused : addressSchema,
      stage: shape.stage,
      assignedInstallerId: opts.canAssign ? blankIsNull(shape.assignedInstallerId) : unused,
      installDate: opts.canAssign ? blankIsNull(shape.installDate) : unused,
      accessNotes: shape.accessNotes,
      notes: shape.notes,
    })
    .transform((v): JobFormOutput => {
      const customer = (v.customer as JobFormOutput['customer'] | undefined) ?? null;
      const propertyAddress = (v.propertyAddress as JobBodyOut['propertyAddress'] | undefined) ?? customer!.address;
      return {
        customer,
        customerId: (v.customerId as string | undefined) ?? null,
        job: {
          propertyAddress,
          stage: v.stage,
          // An estimator's body must not mention them at all: the server refuses it.
          ...(opts.canAssign ? { assignedInstallerId: v.assignedInstallerId as string | null, installDate: v.installDate as string | null } : {}),
          accessNotes: v.accessNotes,
          notes: v.notes,
        },
      };
    }) as unknown as z.ZodType<JobFormOutput, JobFormValues>;
}
