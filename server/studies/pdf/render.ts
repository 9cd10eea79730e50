import 'server-only';
import { createElement } from 'react';
import { renderToBuffer } from '@react-pdf/renderer';
import { StudyRecordDocument, type StudyRecordData } from './study-document';

/** The study's engineering record as PDF bytes. */
export async function renderStudyPdf(data: StudyRecordData): Promise<Buffer> {
  const element = createElement(StudyRecordDocument, data);
  // renderToBuffer's type wants a <Document> element; StudyRecordDocument returns exactly that.
  return renderToBuffer(element as unknown as Parameters<typeof renderToBuffer>[0]);
}

/** "study-42-r2-hollowmere-farm.pdf". */
export function studyPdfFileName(studyId: number, revision: number, title: string): string {
  const slug = title.normalize('NFKD').replace(/[^\w\s-]/g, '').trim().toLowerCase().replace(/[\s_]+/g, '-').slice(0, 40);
  return `study-${studyId}${revision > 1 ? `-r${revision}` : ''}${slug ? `-${slug}` : ''}.pdf`;
}
