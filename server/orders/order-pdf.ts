import PDFDocument from 'pdfkit';
import { writeQuantity } from '../../src/shared/money';

export interface OrderDocument {
  number: string;
  businessName: string;
  siteName: string;
  supplierName: string;
  accountNumber: string | null;
  placedOn: string;
  expectedOn: string | null;
  currency: string;
  lines: { description: string; supplierCode: string | null; quantity: string; unitPrice: string; lineTotal: string }[];
  subtotal: string;
  tax: string;
  deliveryCharge: string;
  total: string;
  paymentTerms: 'card' | 'account';
  notes: string | null;
}

/** The purchase order as an A4 PDF (pdfkit, its built-in Helvetica), for the supplier's e-mail. */
export function orderPdf(doc: OrderDocument): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const pdf = new PDFDocument({ size: 'A4', margin: 50, info: { Title: `Purchase order ${doc.number}`, Author: doc.businessName } });
    const chunks: Buffer[] = [];
    pdf.on('data', (c: Buffer) => chunks.push(c));
    pdf.on('end', () => resolve(Buffer.concat(chunks)));
    pdf.on('error', reject);

    pdf.font('Helvetica-Bold').fontSize(18).text(`Purchase order ${doc.number}`);
    pdf.moveDown(0.5).font('Helvetica').fontSize(10);
    pdf.text(`From: ${doc.businessName}, deliver to ${doc.siteName}`);
    pdf.text(`To: ${doc.supplierName}${doc.accountNumber ? ` (our account ${doc.accountNumber})` : ''}`);
    pdf.text(`Date: ${doc.placedOn}${doc.expectedOn ? `   Delivery expected: ${doc.expectedOn}` : ''}`);
    pdf.text(`Payment: ${doc.paymentTerms === 'card' ? 'by card when ordering' : 'on account, against your invoice'}`);
    pdf.moveDown();

    const cols = [50, 300, 370, 450];
    const head = pdf.y;
    pdf.font('Helvetica-Bold');
    pdf.text('Item', cols[0], head, { width: 240 });
    pdf.text('Packs', cols[1], head, { width: 60, align: 'right' });
    pdf.text(`Each (${doc.currency})`, cols[2], head, { width: 75, align: 'right' });
    pdf.text(`Total (${doc.currency})`, cols[3], head, { width: 95, align: 'right' });
    pdf.font('Helvetica');
    pdf.moveDown(0.5);
    for (const l of doc.lines) {
      const y = pdf.y;
      pdf.text(l.supplierCode ? `${l.description} [${l.supplierCode}]` : l.description, cols[0], y, { width: 240 });
      const after = pdf.y;
      pdf.text(writeQuantity(l.quantity), cols[1], y, { width: 60, align: 'right' });
      pdf.text(l.unitPrice, cols[2], y, { width: 75, align: 'right' });
      pdf.text(l.lineTotal, cols[3], y, { width: 95, align: 'right' });
      pdf.y = Math.max(after, pdf.y);
    }
    pdf.moveDown();
    for (const [label, value] of [['Goods', doc.subtotal], ['Purchase tax', doc.tax], ['Delivery', doc.deliveryCharge], ['Total', doc.total]] as const) {
      const y = pdf.y;
      pdf.font(label === 'Total' ? 'Helvetica-Bold' : 'Helvetica');
      pdf.text(label, cols[2], y, { width: 75, align: 'right' });
      pdf.text(`${value} ${doc.currency}`, cols[3], y, { width: 95, align: 'right' });
    }
    if (doc.notes) {
      pdf.moveDown().font('Helvetica').text(`Notes: ${doc.notes}`, cols[0], pdf.y, { width: 495 });
    }
    pdf.end();
  });
}
