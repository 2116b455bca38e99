import { defaultRiskLadder } from '../../shared/contracts/office';
import type { AreaGeometry } from '../../shared/contracts/outlooks';
import { matchAreas } from '../../shared/distribution/match';
import { demoOutlookAreas } from '../../server/seed/demo-outlook';
import { demoOffice } from '../../server/services/seed.service';
import { startMailCatcher } from '../../server/mail/mail-catcher';
import { createMailer } from '../../server/mail/send-mail';
import type { BenchFigure } from './figures';

/**
 * Matching on publish: 10,000 subscribers with 8 county-sized areas each against the demo
 * outlook's areas (bounding-box prefilter + Turf intersection). Median of 5 runs.
 */
export const matchTenThousandSubscribers: BenchFigure = {
  name: 'match_ms_10000_subscribers_8_areas',
  unit: 'ms',
  measure() {
    const { west, south, east, north } = demoOffice.region;
    let seed = 11;
    const random = () => (seed = (seed * 16807) % 2147483647) / 2147483647;
    const county = (): AreaGeometry => {
      // About 40 km square, placed over the region and a margin around it.
      const x = west - 2 + random() * (east - west + 4);
      const y = south - 2 + random() * (north - south + 4);
      return { type: 'Polygon', coordinates: [[[x, y], [x + 0.45, y], [x + 0.45, y + 0.36], [x, y + 0.36], [x, y]]] };
    };
    const subscribers = Array.from({ length: 10_000 }, () => Array.from({ length: 8 }, county));
    const keys = defaultRiskLadder.map((l) => l.key);
    const run = () => subscribers.reduce((n, areas) => n + (matchAreas(areas, demoOutlookAreas, keys).highestLevelKey ? 1 : 0), 0);
    run();
    const times: number[] = [];
    for (let i = 0; i < 5; i++) {
      const start = performance.now();
      if (run() === 0) throw new Error('match bench: nobody matched');
      times.push(performance.now() - start);
    }
    times.sort((a, b) => a - b);
    return Math.round(times[2] ?? 0);
  },
};

/** Messages per second through nodemailer to the local SMTP catcher on 127.0.0.1 (1,000 messages, 4 at a time). */
export const smtpMessagesPerSecond: BenchFigure = {
  name: 'smtp_msgs_per_s',
  unit: 'msgs/s',
  measure: async () => {
    let received = 0;
    const catcher = await startMailCatcher(async () => {
      received++;
    });
    const mailer = createMailer(catcher.url, 'bench@stormdraft.test');
    try {
      const total = 1000;
      const start = performance.now();
      let next = 0;
      const lane = async () => {
        while (next < total) {
          const i = next++;
          await mailer.send({ to: `subscriber${i}@bench.test`, subject: `Bench ${i}`, html: `<p>Message ${i}</p>`, text: `Message ${i}` });
        }
      };
      await Promise.all([lane(), lane(), lane(), lane()]);
      const seconds = (performance.now() - start) / 1000;
      if (received !== total) throw new Error(`smtp bench: the catcher received ${received} of ${total}`);
      return Math.round(total / seconds);
    } finally {
      mailer.close();
      await catcher.close();
    }
  },
};
