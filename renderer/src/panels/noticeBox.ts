// The verification notice, always from core/notice.ts (the one source of its text).

import { NOTICE_LINES, NOTICE_TITLE } from '../../../core/notice';
import { h } from '../dom';

export function noticeBox(): HTMLElement {
  return h('div', { className: 'notice', role: 'note', 'data-notice': '' },
    h('strong', {}, NOTICE_TITLE),
    h('ul', {}, ...NOTICE_LINES.map((l) => h('li', {}, l))));
}
