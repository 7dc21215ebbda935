import { Injectable, OnModuleInit } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { amountDueMinor, formatMinor, micrometresToMil, STAGE_LABELS } from '@panelpass/shared';
import { DataSource, In } from 'typeorm';
import type { Actor } from '../auth/current-user.decorator';
import { Business } from '../businesses/business.entity';
import { effectiveSettings } from '../businesses/default-settings';
import { notFound } from '../common/app.exception';
import { Customer } from '../customers/customer.entity';
import { Invoice } from '../invoices/invoice.entity';
import { Job } from '../jobs/job.entity';
import type { MailFile } from '../mail/mail.service';
import { MailOutbox } from '../mail/mail-outbox.service';
import { Payment } from '../payments/payment.entity';
import { BlobStore } from '../photos/blob-store.service';
import { Photo } from '../photos/photo.entity';
import { Signature } from '../signatures/signature.entity';
import { Vehicle } from '../vehicles/vehicle.entity';
import { WorkspaceService } from '../workspace/workspace.service';
import { careInstructions } from './care';
import { PdfWriter } from './pdf';

const NIL = '00000000-0000-0000-0000-000000000000';
const MAX_PHOTOS = 36;

export interface PdfFile {
  filename: string;
  content: Buffer;
}

/** "Mar 3, 2026, 2:05 PM CST" in the business's time zone. */
export function when(d: Date | string | null | undefined, timeZone: string): string {
  if (!d) return '-';
  const date = typeof d === 'string' ? new Date(d) : d;
  try {
    return new Intl.DateTimeFormat('en-US', {
      year: 'numeric',
      month: 'short',
      day: 'numeric',
      hour: 'numeric',
      minute: '2-digit',
      timeZoneName: 'short',
      timeZone,
    }).format(date);
  } catch {
    return `${date.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
  }
}

export function vehicleLabel(
  v: Pick<Vehicle, 'colour' | 'make' | 'model' | 'year' | 'bodyStyle'>,
): string {
  return (
    [v.colour, v.year ? String(v.year) : '', v.make, v.model].filter(Boolean).join(' ') ||
    v.bodyStyle
  );
}

const SIGNATURE_WORDS: Record<string, string> = {
  condition: 'Condition on arrival',
  acceptance: 'Work accepted at handover',
  quote: 'Quote accepted',
};

const PAYMENT_WORDS: Record<string, string> = {
  deposit: 'Deposit',
  balance: 'Payment',
  refund: 'Refund',
};

/**
 * The PDFs a customer receives: the job report (what was found, what was done, how to look
 * after it, and who signed what) and the invoice, titled a receipt once it is paid in full.
 * Both are made from the database when asked for, never stored.
 */
@Injectable()
export class DocumentsService implements OnModuleInit {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly workspace: WorkspaceService,
    private readonly blobs: BlobStore,
    private readonly outbox: MailOutbox,
  ) {}

  onModuleInit(): void {
    this.outbox.registerAttachment('report-pdf', async (ref, businessId): Promise<MailFile> => {
      const file = await this.reportPdf(businessId, ref.id);
      return { ...file, contentType: 'application/pdf' };
    });
    this.outbox.registerAttachment('invoice-pdf', async (ref, businessId): Promise<MailFile> => {
      const file = await this.invoicePdf(businessId, ref.id);
      return { ...file, contentType: 'application/pdf' };
    });
  }

  private async business(
    id: string,
  ): Promise<{ business: Business; timeZone: string; mil: boolean }> {
    const business = await this.db.getRepository(Business).findOneByOrFail({ id });
    const settings = effectiveSettings(business.settings);
    return {
      business,
      timeZone: business.timezone || 'UTC',
      mil: settings.units.thickness === 'mil',
    };
  }

  /** The job report of a job of the business (callers check who may see it). */
  async reportPdf(businessId: string, jobId: string): Promise<PdfFile> {
    const m = this.db.manager;
    const job = await m.findOne(Job, { where: { id: jobId, businessId } });
    if (!job) throw notFound('Job');
    // The report is the customer's document: made with what the customer may see.
    const asCustomer: Actor = {
      userId: NIL,
      businessId,
      role: 'customer',
      customerId: job.customerId,
    };
    const [ws, { business, timeZone, mil }, photos, signatures] = await Promise.all([
      this.workspace.get(asCustomer, jobId),
      this.business(businessId),
      m.find(Photo, { where: { jobId, businessId }, order: { takenAt: 'ASC' } }),
      m.find(Signature, { where: { jobId, businessId }, order: { signedAt: 'ASC' } }),
    ]);
    const at = (d: Date | string | null | undefined) => when(d, timeZone);
    const vehicle = vehicleLabel(ws.vehicle);
    const pdf = new PdfWriter(
      `Job report: ${vehicle}`,
      `${business.name} · job report · ${vehicle}`,
    );

    pdf.title(business.name, 'Job report');
    pdf.facts([
      ['Customer', ws.customer.name],
      ['Vehicle', `${vehicle}${ws.vehicle.plate ? ` · ${ws.vehicle.plate}` : ''}`],
      ['Where', job.address],
      ['Visit', `${at(job.windowStart)} to ${at(job.windowEnd)}`],
      ['Stage', STAGE_LABELS[job.stage]],
      ['Services', job.services.join(', ')],
      ['Report made', at(new Date())],
    ]);

    // Condition on arrival.
    pdf.heading('Condition on arrival');
    pdf.para(job.conditionNotes.trim() || 'No condition notes were recorded.');
    if (ws.pins.length) {
      pdf.doc.moveDown(0.5);
      this.drawPins(pdf, ws.pins);
      pdf.table(
        [
          { title: '#', width: 0.5 },
          { title: 'Mark', width: 1.4 },
          { title: 'Severity', width: 1 },
          { title: 'Panel', width: 1.6 },
          { title: 'Note', width: 4 },
        ],
        ws.pins.map((p) => [
          String(p.number),
          p.kind,
          `${p.severity} of 3`,
          ws.panels.find((x) => x.panelKey === p.panelKey)?.label ?? p.panelKey ?? '-',
          p.note || '-',
        ]),
      );
    } else {
      pdf.para('No marks were pinned on the vehicle outline.', { muted: true });
    }

    // Photos.
    if (photos.length) {
      pdf.heading('Photos');
      await this.drawPhotos(pdf, businessId, photos.slice(0, MAX_PHOTOS), at);
      if (photos.length > MAX_PHOTOS) {
        pdf.para(`${photos.length - MAX_PHOTOS} more photos are kept with the job.`, {
          muted: true,
        });
      }
    }

    // Film readings.
    const measured = ws.panels.filter((p) => p.stats.before || p.stats.after);
    pdf.heading('Paint film readings');
    if (measured.length) {
      const show = (um: number | undefined) =>
        um === undefined
          ? '-'
          : mil
            ? `${Math.round(um)} µm (${micrometresToMil(um).toFixed(2)} mil)`
            : `${Math.round(um)} µm`;
      pdf.para(
        'Mean of the gauge readings on each panel, before and after the work. Readings a gauge cannot take on a panel’s material are left out.',
        { muted: true },
      );
      pdf.table(
        [
          { title: 'Panel', width: 2.2 },
          { title: 'Before', width: 1.6, align: 'right' },
          { title: 'After', width: 1.6, align: 'right' },
          { title: 'Taken off', width: 1.4, align: 'right' },
        ],
        measured.map((p) => {
          const before = p.stats.before?.meanUm;
          const after = p.stats.after?.meanUm;
          return [
            p.label,
            show(before),
            show(after),
            before !== undefined && after !== undefined ? show(Math.max(0, before - after)) : '-',
          ];
        }),
      );
    } else {
      pdf.para('No film thickness readings were taken.', { muted: true });
    }

    // Correction passes.
    const worked = ws.panels.filter((p) => p.passes.length);
    pdf.heading('Machine correction');
    if (worked.length) {
      const products = new Map(ws.products.map((p) => [p.id, p.name]));
      pdf.table(
        [
          { title: 'Panel', width: 2 },
          { title: 'Passes', width: 0.9, align: 'right' },
          { title: 'Steps', width: 2 },
          { title: 'Machine, pad and product', width: 4 },
        ],
        worked.map((p) => {
          const combos = [
            ...new Set(
              p.passes.map((x) =>
                [x.machine, x.pad, x.productId ? products.get(x.productId) : null]
                  .filter(Boolean)
                  .join(', '),
              ),
            ),
          ];
          return [
            p.label,
            String(p.passes.reduce((a, x) => a + x.passes, 0)),
            [...new Set(p.passes.map((x) => x.step))].join(', '),
            combos.join('; '),
          ];
        }),
      );
    } else {
      pdf.para('No machine correction was logged.', { muted: true });
    }

    // Chips.
    if (ws.chips.length) {
      pdf.heading('Chips touched up');
      pdf.table(
        [
          { title: '#', width: 0.5 },
          { title: 'Panel', width: 2 },
          { title: 'Size', width: 1, align: 'right' },
          { title: 'Layers', width: 1.2, align: 'right' },
          { title: 'Note', width: 3.5 },
        ],
        ws.chips.map((c) => [
          String(c.number),
          ws.panels.find((p) => p.id === c.panelId)?.label ?? '-',
          `${c.sizeMm} mm`,
          `${c.layers.length} of ${c.layersPlanned}`,
          c.note || '-',
        ]),
      );
    }

    // Protection and its keep-dry window.
    const keepDry = ws.timers.filter((t) => t.kind === 'keep-dry' && !t.cancelledAt);
    pdf.heading('Protection');
    if (keepDry.length) {
      pdf.table(
        [
          { title: 'Protection', width: 3 },
          { title: 'Applied', width: 2 },
          { title: 'Keep dry until', width: 2 },
        ],
        keepDry.map((t) => [t.label, at(t.startedAt), at(t.endsAt)]),
      );
    } else {
      pdf.para('No protection with a keep-dry window was recorded.', { muted: true });
    }
    const lastDry = keepDry
      .map((t) => new Date(t.endsAt))
      .sort((a, b) => b.getTime() - a.getTime())[0];

    pdf.heading('Looking after the finish');
    pdf.bullets(
      careInstructions({
        keepDryUntil: lastDry && lastDry.getTime() > Date.now() ? at(lastDry) : null,
        hasChips: ws.chips.length > 0,
        hasProtection: keepDry.length > 0,
      }),
    );

    // Signatures.
    pdf.heading('Signatures');
    if (signatures.length) {
      pdf.para(
        'Each signature was given over the record shown at the time. The fingerprint is the SHA-256 of that record (canonical JSON); it changes if a single character of the record does.',
        { muted: true },
      );
      for (const s of signatures) {
        pdf.room(110);
        pdf.doc.moveDown(0.5);
        pdf.facts([
          ['Signed for', SIGNATURE_WORDS[s.kind] ?? s.kind],
          ['Signed by', s.signerName],
          ['When', at(s.signedAt)],
        ]);
        pdf.doc
          .font('Courier')
          .fontSize(8)
          .text(`SHA-256 ${s.recordHash}`, pdf.left + 110);
        pdf.doc.font('Helvetica').fontSize(10);
        const image = await this.blobs.readBytes(businessId, s.imageSha256);
        if (image) {
          const y = pdf.doc.y + 4;
          if (pdf.image(image, pdf.left + 110, y, 180, 60)) pdf.doc.y = y + 64;
        }
        pdf.rule();
      }
    } else {
      pdf.para('Nothing has been signed for this job yet.', { muted: true });
    }

    return {
      filename: `job-report-${slug(vehicle)}-${job.id.slice(0, 8)}.pdf`,
      content: await pdf.finish(),
    };
  }

  private drawPins(pdf: PdfWriter, pins: { number: number; x: number; y: number }[]): void {
    const w = 240;
    const h = 150;
    pdf.room(h + 30);
    const x0 = pdf.left;
    const y0 = pdf.doc.y;
    pdf.doc.roundedRect(x0, y0, w, h, 10).lineWidth(1).strokeColor('#55625b').stroke();
    for (const p of pins) {
      const cx = x0 + Math.min(1, Math.max(0, p.x)) * w;
      const cy = y0 + Math.min(1, Math.max(0, p.y)) * h;
      pdf.doc.circle(cx, cy, 7).fill('#b3261e');
      pdf.doc
        .fillColor('#ffffff')
        .font('Helvetica-Bold')
        .fontSize(7)
        .text(String(p.number), cx - 7, cy - 3.5, { width: 14, align: 'center', lineBreak: false });
    }
    pdf.doc
      .font('Helvetica')
      .fontSize(8)
      .fillColor('#55625b')
      .text('Where each mark was pinned on the vehicle outline in the app.', x0 + w + 12, y0 + 4, {
        width: pdf.width - w - 12,
      });
    pdf.doc.font('Helvetica').fontSize(10).fillColor('#17201b');
    pdf.doc.x = pdf.left;
    pdf.doc.y = y0 + h + 10;
  }

  private async drawPhotos(
    pdf: PdfWriter,
    businessId: string,
    photos: Photo[],
    at: (d: Date) => string,
  ): Promise<void> {
    const perRow = 3;
    const gap = 10;
    const cellW = (pdf.width - gap * (perRow - 1)) / perRow;
    const cellH = cellW * 0.75;
    for (let i = 0; i < photos.length; i += perRow) {
      pdf.room(cellH + 36);
      const y = pdf.doc.y;
      const row = photos.slice(i, i + perRow);
      for (const [j, photo] of row.entries()) {
        const x = pdf.left + j * (cellW + gap);
        const bytes = await this.blobs.readBytes(businessId, photo.sha256);
        const drawn =
          bytes && photo.mime !== 'image/webp' ? pdf.image(bytes, x, y, cellW, cellH) : false;
        if (!drawn) {
          pdf.doc.rect(x, y, cellW, cellH).fill('#e6ebe7');
          pdf.doc
            .fillColor('#55625b')
            .fontSize(8)
            .text(
              photo.mime === 'image/webp' ? 'WebP photo: see the app' : 'Photo not available',
              x,
              y + cellH / 2 - 4,
              { width: cellW, align: 'center' },
            );
        }
        pdf.doc
          .font('Helvetica')
          .fontSize(8)
          .fillColor('#17201b')
          .text(
            [photo.kind, photo.caption, at(photo.takenAt)].filter(Boolean).join(' · '),
            x,
            y + cellH + 3,
            { width: cellW, height: 24, ellipsis: true },
          );
      }
      pdf.doc.x = pdf.left;
      pdf.doc.y = y + cellH + 30;
    }
    pdf.doc.fontSize(10);
  }

  /** The invoice of the business (callers check who may see it); "Receipt" once paid in full. */
  async invoicePdf(businessId: string, invoiceId: string): Promise<PdfFile> {
    const m = this.db.manager;
    const invoice = await m.findOne(Invoice, { where: { id: invoiceId, businessId } });
    if (!invoice) throw notFound('Invoice');
    const job = await m.findOneOrFail(Job, { where: { id: invoice.jobId }, withDeleted: true });
    const [customer, vehicle, { business, timeZone }, payments] = await Promise.all([
      m.findOneOrFail(Customer, { where: { id: job.customerId }, withDeleted: true }),
      m.findOneOrFail(Vehicle, { where: { id: job.vehicleId }, withDeleted: true }),
      this.business(businessId),
      m.find(Payment, {
        where: { jobId: job.id, status: In(['succeeded']) },
        order: { paidAt: 'ASC', createdAt: 'ASC' },
      }),
    ]);
    const at = (d: Date | null) => when(d, timeZone);
    const money = (n: number) => formatMinor(n, invoice.currency);
    const due = amountDueMinor(
      invoice.totalMinor,
      payments.map((p) => ({
        kind: p.kind as 'deposit' | 'balance' | 'refund',
        status: p.status,
        amountMinor: p.amountMinor,
      })),
    );
    const paidInFull = invoice.totalMinor > 0 && due === 0;
    const kind = paidInFull ? 'Receipt' : 'Invoice';
    const numberText = String(invoice.number).padStart(5, '0');
    const pdf = new PdfWriter(
      `${kind} ${numberText}`,
      `${business.name} · ${kind.toLowerCase()} ${numberText}`,
    );

    pdf.title(business.name, `${kind} no. ${numberText}`);
    pdf.facts([
      ['Issued', at(invoice.issuedAt)],
      ['Billed to', [customer.name, customer.address, customer.email].filter(Boolean).join('\n')],
      ['Vehicle', `${vehicleLabel(vehicle)}${vehicle.plate ? ` · ${vehicle.plate}` : ''}`],
      ['Visit', at(job.windowStart)],
    ]);
    pdf.doc.moveDown(0.8);
    const lines = invoice.lines as unknown as {
      description: string;
      quantity: number;
      unitPriceMinor: number;
      amountMinor: number;
    }[];
    pdf.table(
      [
        { title: 'Description', width: 5 },
        { title: 'Qty', width: 0.8, align: 'right' },
        { title: 'Unit price', width: 1.6, align: 'right' },
        { title: 'Amount', width: 1.6, align: 'right' },
      ],
      lines.map((l) => [
        l.description,
        String(l.quantity),
        money(l.unitPriceMinor),
        money(l.amountMinor),
      ]),
      { fontSize: 10 },
    );
    const totals: [string, string][] = [
      ['Subtotal', money(invoice.subtotalMinor)],
      [invoice.taxLabel || 'Tax', money(invoice.taxMinor)],
      ['Total', money(invoice.totalMinor)],
    ];
    for (const [label, value] of totals) {
      pdf.room(18);
      const y = pdf.doc.y;
      const bold = label === 'Total';
      pdf.doc
        .font(bold ? 'Helvetica-Bold' : 'Helvetica')
        .fontSize(bold ? 12 : 10)
        .text(label, pdf.left, y, { width: pdf.width * 0.75, align: 'right' });
      pdf.doc.text(value, pdf.left + pdf.width * 0.75, y, {
        width: pdf.width * 0.25,
        align: 'right',
      });
      pdf.doc.moveDown(0.2);
    }
    pdf.doc.font('Helvetica').fontSize(10);

    pdf.heading('Payments');
    if (payments.length) {
      pdf.table(
        [
          { title: 'Date', width: 2.2 },
          { title: 'For', width: 1.5 },
          { title: 'How', width: 1.5 },
          { title: 'Amount', width: 1.6, align: 'right' },
        ],
        payments.map((p) => [
          at(p.paidAt ?? p.createdAt),
          PAYMENT_WORDS[p.kind] ?? p.kind,
          p.method,
          p.kind === 'refund' ? `-${money(p.amountMinor)}` : money(p.amountMinor),
        ]),
      );
    } else {
      pdf.para('No payment has been received yet.', { muted: true });
    }
    pdf.para(paidInFull ? 'Paid in full. Thank you.' : `Still to pay: ${money(due)}`, {
      bold: true,
      size: 12,
    });
    return { filename: `${kind.toLowerCase()}-${numberText}.pdf`, content: await pdf.finish() };
  }
}

function slug(s: string): string {
  return (
    s
      .normalize('NFKD')
      .replace(/[\u0300-\u036f]/g, '')
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-|-$/g, '')
      .slice(0, 40) || 'vehicle'
  );
}
