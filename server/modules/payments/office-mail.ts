import { Op } from 'sequelize';
import type { Mailer } from '../../lib/mailer';
import { User } from '../../db/models/user';
import { CompanySetting } from '../../db/models/company-setting';

/** E-mail every active office user of the company (or the company address when there are none). */
export async function mailOffice(mailer: Mailer, organisationId: string, subject: string, text: string): Promise<void> {
  const users = await User.findAll({ where: { organisationId, role: 'office', active: true, email: { [Op.ne]: '' } }, attributes: ['email'] });
  let to = users.map((u) => u.email);
  if (to.length === 0) {
    const company = await CompanySetting.findByPk(organisationId);
    if (company?.email) to = [company.email];
  }
  if (to.length === 0) return;
  await mailer.send({ to: to.join(', '), subject, text });
}
