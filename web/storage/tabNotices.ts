// Notices between workbench tabs open in the same browser (BroadcastChannel): after each save a
// tab tells the others which project reached which revision, so they can reload or warn.

/** What a tab announces. */
export interface TabNotice {
  type: 'saved';
  projectId: string;
  revision: number;
  /** The announcing tab (a tab ignores its own notices). */
  tabId: string;
}

/** Channel name shared by all workbench tabs. */
export const tabChannelName = 'barwright-workbench';

/** One tab's end of the channel. Works without BroadcastChannel (then it simply stays silent). */
export class TabNotices {
  readonly tabId = crypto.randomUUID();
  private readonly channel: BroadcastChannel | null;

  constructor(onNotice: (notice: TabNotice) => void, name: string = tabChannelName) {
    this.channel = typeof BroadcastChannel === 'function' ? new BroadcastChannel(name) : null;
    this.channel?.addEventListener('message', (event: MessageEvent<TabNotice>) => {
      const notice = event.data;
      if (notice && notice.type === 'saved' && notice.tabId !== this.tabId) onNotice(notice);
    });
  }

  /** Tells the other tabs a project was saved at a revision. */
  announceSaved(projectId: string, revision: number): void {
    this.channel?.postMessage({ type: 'saved', projectId, revision, tabId: this.tabId } satisfies TabNotice);
  }

  /** Closes the channel. */
  close(): void {
    this.channel?.close();
  }
}
