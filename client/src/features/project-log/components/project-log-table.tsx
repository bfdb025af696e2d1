import type { ProjectLogEntry } from '@shared/api';
import { formatDateTime } from '../../../lib/format';
import { RowHeader, Table, TBody, Td, Th, THead, Tr } from '../../../ui';
import { actionLabel, detailWords } from './log-words';

/** The entries of one page, newest first. */
export function ProjectLogTable({ entries, caption }: { entries: ProjectLogEntry[]; caption: string }) {
  return (
    <Table caption={caption}>
      <THead>
        <Tr>
          <Th>When</Th>
          <Th>Who</Th>
          <Th>What</Th>
          <Th>About</Th>
          <Th>Details</Th>
          <Th>Reason</Th>
        </Tr>
      </THead>
      <TBody>
        {entries.map((e) => (
          <Tr key={e.id}>
            <Td className="whitespace-nowrap">
              <time dateTime={e.at}>{formatDateTime(e.at)}</time>
            </Td>
            <Td className="max-w-48 break-words">
              {e.by ? (
                <>
                  {e.by.name}
                  <span className="block text-fine text-muted">{e.by.email}</span>
                </>
              ) : (
                <span className="text-muted">Gaugeline</span>
              )}
            </Td>
            <RowHeader className="whitespace-nowrap font-normal">{actionLabel(e.action)}</RowHeader>
            <Td className="max-w-64 break-words">{e.subject}</Td>
            <Td className="max-w-96 break-words text-fine">{detailWords(e) || <span className="text-muted">—</span>}</Td>
            <Td className="max-w-64 break-words text-fine">{e.reason ?? <span className="text-muted">—</span>}</Td>
          </Tr>
        ))}
      </TBody>
    </Table>
  );
}
