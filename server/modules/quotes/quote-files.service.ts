import type { AppDeps } from '../../deps';
import { loadCompanySettings } from '../settings/settings.service';
import { quoteFileName, quotePdf } from './quote-document';
import { snapshotOf } from './quote-dto';
import { quoteCsv, quoteXlsx } from './quote-exports';
import { findJobInOrg, findQuoteInOrg, linesOf, quoteDto, withDerivedStatus } from './quotes.service';

type Actor = { organisationId: string };

/** A quote as a file for the office: PDF, CSV or XLSX, each with its file name. */
export function createQuoteFilesService(deps: AppDeps) {
  async function exportInput(actor: Actor, id: string) {
    const q = withDerivedStatus(await findQuoteInOrg(actor, id));
    const job = await findJobInOrg(actor, q.jobId);
    return { q, job, input: { quote: await quoteDto(q), jobReference: job.reference, customerName: job.customer!.name, spaces: snapshotOf(q).spaces } };
  }
  return {
    async pdf(actor: Actor, id: string): Promise<{ filename: string; body: Buffer }> {
      const { q, job } = await exportInput(actor, id);
      const body = await quotePdf(q, await linesOf(q), job, await loadCompanySettings(q.organisationId), deps.storage, null);
      return { filename: quoteFileName(q, 'pdf'), body };
    },
    async csv(actor: Actor, id: string) {
      const { q, input } = await exportInput(actor, id);
      return { filename: quoteFileName(q, 'csv'), body: quoteCsv(input) };
    },
    async xlsx(actor: Actor, id: string) {
      const { q, input } = await exportInput(actor, id);
      return { filename: quoteFileName(q, 'xlsx'), body: await quoteXlsx(input) };
    },
  };
}

export type QuoteFilesService = ReturnType<typeof createQuoteFilesService>;
