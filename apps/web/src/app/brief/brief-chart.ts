import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import type { ChartFigure } from '@seinework/contracts';

/** A brief's chart as inline SVG (so it prints as vectors): the server's shapes, drawn as they are. */
@Component({
  selector: 'sw-brief-chart',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <figure>
      <svg [attr.viewBox]="'0 0 ' + figure().width + ' ' + figure().height" role="img" [attr.aria-label]="figure().description" preserveAspectRatio="xMidYMid meet">
        @for (shape of figure().shapes; track $index) {
          @switch (shape.kind) {
            @case ('line') {
              <svg:line [attr.x1]="shape.x1" [attr.y1]="shape.y1" [attr.x2]="shape.x2" [attr.y2]="shape.y2" [attr.stroke]="shape.stroke" [attr.stroke-width]="shape.width" [attr.stroke-dasharray]="shape.dash ? '3 2' : null" />
            }
            @case ('polyline') {
              <svg:polyline [attr.points]="pointsOf(shape.points)" fill="none" [attr.stroke]="shape.stroke" [attr.stroke-width]="shape.width" stroke-linejoin="round" />
            }
            @case ('circle') {
              <svg:circle [attr.cx]="shape.cx" [attr.cy]="shape.cy" [attr.r]="shape.r" [attr.fill]="shape.fill" />
            }
            @case ('rect') {
              <svg:rect [attr.x]="shape.x" [attr.y]="shape.y" [attr.width]="shape.w" [attr.height]="shape.h" [attr.fill]="shape.fill" />
            }
            @case ('text') {
              <svg:text [attr.x]="shape.x" [attr.y]="shape.y" [attr.font-size]="shape.size" [attr.text-anchor]="shape.anchor" [attr.font-weight]="shape.bold ? 500 : 400" [attr.fill]="shape.colour">{{ shape.text }}</svg:text>
            }
          }
        }
      </svg>
      <figcaption>{{ figure().description }}</figcaption>
    </figure>
  `,
  styles: `
    figure { margin: 0 0 16px; break-inside: avoid; }
    svg { display: block; width: 100%; max-width: 720px; height: auto; margin: 0 auto; font-family: Roboto, sans-serif; }
    figcaption { font-size: 0.75rem; color: var(--mat-sys-on-surface-variant); margin-top: 4px; }
  `,
})
export class BriefChart {
  readonly figure = input.required<ChartFigure>();

  protected pointsOf(points: [number, number][]): string {
    return points.map(([x, y]) => `${x.toFixed(2)},${y.toFixed(2)}`).join(' ');
  }
}
