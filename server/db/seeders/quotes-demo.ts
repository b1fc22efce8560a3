import { Organisation } from '../models';
import { seedDemoCatalogue } from '../../modules/settings/settings.service';
import { DEMO_COMPANY, OTHER_COMPANY } from './demo';

/**
 * Gives the demo companies their company details, invented catalogue prices and the default dated
 * tax rates. Idempotent (only fills what is missing), so it also runs on a database seeded before
 * the quotes module existed. All names, addresses and e-mails are invented (example.com).
 */
export async function seedQuotesDemo(): Promise<void> {
  const details: Record<string, Parameters<typeof seedDemoCatalogue>[1]> = {
    [DEMO_COMPANY]: {
      companyName: DEMO_COMPANY,
      address: { line1: 'Unit 7, Kilnworks Yard', line2: 'Station Road', town: 'Ashcombe', postcode: 'AB1 5YZ' },
      email: 'quotes@hearthfold.example.com',
      phone: '01632 960000',
      taxNumber: 'GB 000 0000 00',
    },
    [OTHER_COMPANY]: {
      companyName: OTHER_COMPANY,
      address: { line1: '2 Mill Lane', line2: '', town: 'Northgate', postcode: 'NG9 4CC' },
      email: 'office@northgate.example.com',
      phone: '01632 960900',
    },
  };
  for (const [name, company] of Object.entries(details)) {
    const org = await Organisation.findOne({ where: { name } });
    if (!org) continue;
    await seedDemoCatalogue(org.id, company);
  }
}
