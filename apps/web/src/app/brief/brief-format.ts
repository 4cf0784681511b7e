import { Pipe, type PipeTransform } from '@angular/core';
import { formatDate, formatNumber, formatSigned } from '@seinework/contracts';

/** Numbers and dates as the PDF brief writes them. */
@Pipe({ name: 'briefNumber' })
export class BriefNumberPipe implements PipeTransform {
  transform(value: number | null | undefined, signed = false, digits = 4): string {
    return signed ? formatSigned(value, digits) : formatNumber(value, digits);
  }
}

@Pipe({ name: 'briefDate' })
export class BriefDatePipe implements PipeTransform {
  transform(value: string): string {
    return formatDate(value);
  }
}

@Pipe({ name: 'briefPercent' })
export class BriefPercentPipe implements PipeTransform {
  transform(share: number): string {
    return `${(share * 100).toFixed(1)} %`;
  }
}
