import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { DecimalPipe } from '@angular/common';
import type { Web } from '@seinework/contracts';
import { NODE_RADIUS, layoutWeb, linkWidth } from './web-diagram-layout';

const LABEL_LINE = 16;

/** A picture of the web: compartments by trophic level, flows as arrows as wide as they are large. */
@Component({
  selector: 'sw-web-diagram',
  imports: [DecimalPipe],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './web-diagram.html',
  styleUrl: './web-diagram.scss',
})
export class WebDiagram {
  readonly web = input.required<Web>();
  readonly trophicLevels = input.required<Record<string, number>>();

  protected readonly radius = NODE_RADIUS;
  protected readonly layout = computed(() => layoutWeb(this.web(), this.trophicLevels()));
  protected readonly description = computed(() => {
    const { nodes, links } = this.layout();
    return `${nodes.length} compartments placed by trophic level, ${links.length} flows drawn as arrows whose width grows with the square root of the flow. The table below lists every flow.`;
  });
  /** Three sample widths for the legend at round numbers: about the largest flow, a tenth and a hundredth of it. */
  protected readonly legendFlows = computed(() => {
    const max = this.layout().maxValue;
    if (max <= 0) return [];
    const magnitude = 10 ** Math.floor(Math.log10(max));
    const largest = Math.floor(max / magnitude) * magnitude;
    return [largest, largest / 10, largest / 100].map((value) => ({ value, width: linkWidth(value, max) }));
  });
  protected readonly flowRows = computed(() => [...this.layout().links].sort((a, b) => a.fromName.localeCompare(b.fromName) || b.value - a.value));

  /** A compartment name broken into lines of about sixteen characters at spaces. */
  protected labelLines(name: string): string[] {
    const lines: string[] = [];
    for (const word of name.split(/\s+/)) {
      const last = lines.at(-1);
      if (last !== undefined && (last + ' ' + word).length <= LABEL_LINE) lines[lines.length - 1] = last + ' ' + word;
      else lines.push(word);
    }
    return lines;
  }
}
