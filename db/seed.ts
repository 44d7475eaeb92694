/**
 * The demo scenario: an invented consortium of two sites and three telescopes, with a
 * semester of blocks from 30 days before `today` to 150 days after, so the demo is
 * always live. Every name and number here is invented.
 */
import { getTimes } from "suncalc";
import type { Db, Trx } from "./index";
import type { BlockKind, Role } from "./types";

export const DEMO_PASSWORD = "nightbreak-demo";

export const DEMO_USERS: Array<{ email: string; name: string; roles: Role[] }> = [
  { email: "pi@nightbreak.test", name: "Ilona Marsh", roles: ["pi"] },
  { email: "director@nightbreak.test", name: "Tomasz Okafor-Lind", roles: ["director"] },
  { email: "observer@nightbreak.test", name: "Rafa Quennell", roles: ["observer"] },
  { email: "night@nightbreak.test", name: "Sunniva Berg-Arce", roles: ["night_assistant"] },
  { email: "admin@nightbreak.test", name: "Dov Hartigan", roles: ["admin"] },
];

const MORE_PEOPLE: Array<{ email: string; name: string; roles: Role[] }> = [
  { email: "a.velasko@nightbreak.test", name: "Amaru Velasko", roles: ["pi", "observer"] },
  { email: "h.lindqvist@nightbreak.test", name: "Hedda Lindqvist", roles: ["pi"] },
  { email: "k.obuya@nightbreak.test", name: "Kwame Obuya", roles: ["pi", "observer"] },
  { email: "m.drezner@nightbreak.test", name: "Mira Drezner", roles: ["pi"] },
  { email: "s.parvani@nightbreak.test", name: "Soraya Parvani", roles: ["pi", "observer"] },
  { email: "j.tallis@nightbreak.test", name: "Jonah Tallis", roles: ["observer"] },
  { email: "e.moravec@nightbreak.test", name: "Elin Moravec", roles: ["observer"] },
  { email: "p.achterberg@nightbreak.test", name: "Pim Achterberg", roles: ["observer"] },
  { email: "l.santiago@nightbreak.test", name: "Luz Santillán", roles: ["night_assistant"] },
  { email: "o.raines@nightbreak.test", name: "Oskar Raines", roles: ["night_assistant"] },
  { email: "d.ferro@nightbreak.test", name: "Dalia Ferro", roles: ["director", "pi"] },
];

const SITES = [
  { code: "AQS", name: "Alto Quebrada Station", latitude_deg: -30.52, longitude_deg: -70.41, height_m: 2310, time_zone: "America/Santiago" },
  { code: "SOO", name: "Sierra Orla Observatory", latitude_deg: 38.41, longitude_deg: -3.72, height_m: 1850, time_zone: "Europe/Madrid" },
];

const TELESCOPES = [
  { code: "AQ41", site: "AQS", name: "Quebrada 4.1 m", aperture_m: 4.1, min_altitude_deg: 25, max_airmass: 2.4, sun_avoidance_deg: 45, hour_angle_min_h: -5, hour_angle_max_h: 5, setup_minutes: 15 },
  { code: "AQ16", site: "AQS", name: "Quebrada 1.6 m", aperture_m: 1.6, min_altitude_deg: 20, max_airmass: 2.9, sun_avoidance_deg: 30, hour_angle_min_h: -6, hour_angle_max_h: 6, setup_minutes: 8 },
  { code: "SO25", site: "SOO", name: "Orla 2.5 m", aperture_m: 2.5, min_altitude_deg: 22, max_airmass: 2.7, sun_avoidance_deg: 40, hour_angle_min_h: -5.5, hour_angle_max_h: 5.5, setup_minutes: 12 },
];

const INSTRUMENTS = [
  { telescope: "AQ41", code: "LYRA", name: "Lyra wide-field imager", limiting_magnitude: 24.8 },
  { telescope: "AQ41", code: "ESTRO", name: "Estro low-resolution spectrograph", limiting_magnitude: 21.5 },
  { telescope: "AQ16", code: "PICO", name: "Pico fast-readout camera", limiting_magnitude: 21.9 },
  { telescope: "SO25", code: "VELA", name: "Vela imager", limiting_magnitude: 23.6 },
  { telescope: "SO25", code: "ARPA", name: "Arpa echelle spectrograph", limiting_magnitude: 17.8 },
];

const PARTNERS = [
  { code: "AUR", name: "Aurelian Universities" },
  { code: "BRC", name: "Borean Research Council" },
  { code: "CAL", name: "Calder Institutes" },
  { code: "CON", name: "Consortium office" },
];

type ProgramSeed = { code: string; title: string; partner: string; pi: string; rank: number; hours: number; category: BlockKind; too?: boolean; observers: string[] };

const PROGRAMS: ProgramSeed[] = [
  { code: "TOO-01", title: "Rapid photometry of fast-moving small bodies", partner: "AUR", pi: "pi@nightbreak.test", rank: 1, hours: 24, category: "science", too: true, observers: ["observer@nightbreak.test"] },
  { code: "TOO-02", title: "Early spectra of young stellar explosions", partner: "BRC", pi: "d.ferro@nightbreak.test", rank: 1, hours: 18, category: "science", too: true, observers: ["j.tallis@nightbreak.test"] },
  { code: "SCI-101", title: "Dust lanes in nearby edge-on spirals", partner: "AUR", pi: "a.velasko@nightbreak.test", rank: 2, hours: 60, category: "science", observers: ["observer@nightbreak.test", "a.velasko@nightbreak.test"] },
  { code: "SCI-102", title: "Period changes in short-period pulsators", partner: "AUR", pi: "h.lindqvist@nightbreak.test", rank: 3, hours: 45, category: "science", observers: ["e.moravec@nightbreak.test"] },
  { code: "SCI-103", title: "A census of cool white-dwarf companions", partner: "BRC", pi: "k.obuya@nightbreak.test", rank: 2, hours: 70, category: "science", observers: ["k.obuya@nightbreak.test", "p.achterberg@nightbreak.test"] },
  { code: "SCI-104", title: "Metallicity gradients in the outer disc", partner: "BRC", pi: "m.drezner@nightbreak.test", rank: 4, hours: 40, category: "science", observers: ["j.tallis@nightbreak.test"] },
  { code: "SCI-105", title: "Eclipse timing of compact binaries", partner: "CAL", pi: "s.parvani@nightbreak.test", rank: 2, hours: 55, category: "science", observers: ["s.parvani@nightbreak.test", "observer@nightbreak.test"] },
  { code: "SCI-106", title: "Rotation curves of low-surface-brightness galaxies", partner: "CAL", pi: "h.lindqvist@nightbreak.test", rank: 3, hours: 50, category: "science", observers: ["e.moravec@nightbreak.test"] },
  { code: "SCI-107", title: "Flaring activity of young M dwarfs", partner: "AUR", pi: "k.obuya@nightbreak.test", rank: 5, hours: 30, category: "science", observers: ["p.achterberg@nightbreak.test"] },
  { code: "SCI-108", title: "Deep imaging of tidal streams", partner: "CAL", pi: "a.velasko@nightbreak.test", rank: 3, hours: 65, category: "science", observers: ["a.velasko@nightbreak.test"] },
  { code: "SCI-109", title: "Spectroscopic monitoring of accreting binaries", partner: "BRC", pi: "s.parvani@nightbreak.test", rank: 4, hours: 35, category: "science", observers: ["j.tallis@nightbreak.test", "observer@nightbreak.test"] },
  { code: "SCI-110", title: "Light echoes around recurrent novae", partner: "AUR", pi: "m.drezner@nightbreak.test", rank: 5, hours: 25, category: "science", observers: ["e.moravec@nightbreak.test"] },
  { code: "ENG-01", title: "Instrument commissioning and focus runs", partner: "CON", pi: "admin@nightbreak.test", rank: 5, hours: 40, category: "engineering", observers: [] },
  { code: "DDT-01", title: "Director's discretionary time", partner: "CON", pi: "director@nightbreak.test", rank: 5, hours: 30, category: "discretionary", observers: [] },
  { code: "PAY-01", title: "Payback of displaced time", partner: "CON", pi: "director@nightbreak.test", rank: 3, hours: 0, category: "payback", observers: [] },
];

const ASSISTANTS: Record<string, string[]> = {
  "night@nightbreak.test": ["AQ41", "AQ16"],
  "l.santiago@nightbreak.test": ["AQ41", "AQ16"],
  "o.raines@nightbreak.test": ["SO25"],
};

const DAY_MS = 86_400_000;
const QUARTER_HOUR = 15 * 60_000;

/** A small deterministic PRNG (mulberry32) so the same day seeds the same schedule. */
function prng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const roundToQuarter = (ms: number) => Math.round(ms / QUARTER_HOUR) * QUARTER_HOUR;

/**
 * The dark part of each night at a site, from nautical dusk to nautical dawn (suncalc is
 * ample for laying out demo blocks; the sky engine does the real work).
 */
export function demoNights(site: { latitude_deg: number; longitude_deg: number }, firstDay: Date, days: number): Array<{ start: Date; end: Date }> {
  const nights: Array<{ start: Date; end: Date }> = [];
  for (let d = 0; d < days; d++) {
    const noon = new Date(firstDay.getTime() + d * DAY_MS + (12 - site.longitude_deg / 15) * 3_600_000);
    const evening = getTimes(noon, site.latitude_deg, site.longitude_deg).nauticalDusk;
    const morning = getTimes(new Date(noon.getTime() + DAY_MS), site.latitude_deg, site.longitude_deg).nauticalDawn;
    if (evening && morning && morning > evening) {
      nights.push({ start: new Date(roundToQuarter(evening.getTime())), end: new Date(roundToQuarter(morning.getTime())) });
    }
  }
  return nights;
}

function startOfUtcDay(date: Date): Date {
  return new Date(Date.UTC(date.getUTCFullYear(), date.getUTCMonth(), date.getUTCDate()));
}

async function idsByCode(trx: Trx, table: "sites" | "telescopes" | "partners" | "programs"): Promise<Map<string, string>> {
  const rows = await trx.selectFrom(table).select(["id", "code"]).execute();
  return new Map(rows.map((r) => [r.code, r.id]));
}

export async function isSeeded(db: Db): Promise<boolean> {
  return !!(await db.selectFrom("users").select("id").limit(1).executeTakeFirst());
}

export async function seedDemo(db: Db, options: { today?: Date; passwordHash: string }): Promise<{ blocks: number; users: number }> {
  const today = startOfUtcDay(options.today ?? new Date());
  const first = new Date(today.getTime() - 30 * DAY_MS);
  const days = 181;

  return db.transaction().execute(async (trx) => {
    const people = [...DEMO_USERS, ...MORE_PEOPLE];
    const userRows = await trx
      .insertInto("users")
      .values(people.map((p) => ({ email: p.email, name: p.name, password_hash: options.passwordHash })))
      .returning(["id", "email"])
      .execute();
    const userId = new Map(userRows.map((u) => [u.email, u.id]));
    const uid = (email: string) => {
      const id = userId.get(email);
      if (!id) throw new Error(`seed: unknown user ${email}`);
      return id;
    };
    await trx.insertInto("user_roles").values(people.flatMap((p) => p.roles.map((role) => ({ user_id: uid(p.email), role })))).execute();

    await trx.insertInto("sites").values(SITES).execute();
    const siteId = await idsByCode(trx, "sites");
    await trx
      .insertInto("telescopes")
      .values(TELESCOPES.map(({ site, ...t }) => ({ ...t, site_id: siteId.get(site) ?? "" })))
      .execute();
    const telescopeId = await idsByCode(trx, "telescopes");
    const instrumentRows = await trx
      .insertInto("instruments")
      .values(INSTRUMENTS.map(({ telescope, ...i }) => ({ ...i, telescope_id: telescopeId.get(telescope) ?? "" })))
      .returning(["id", "telescope_id"])
      .execute();
    for (const [email, codes] of Object.entries(ASSISTANTS)) {
      await trx
        .insertInto("telescope_assistants")
        .values(codes.map((c) => ({ telescope_id: telescopeId.get(c) ?? "", user_id: uid(email) })))
        .execute();
    }

    await trx.insertInto("partners").values(PARTNERS).execute();
    const partnerId = await idsByCode(trx, "partners");
    const semesterCode = `S${today.getUTCFullYear()}-${today.getUTCMonth() < 6 ? "A" : "B"}`;
    const { id: semesterId } = await trx
      .insertInto("semesters")
      .values({ code: semesterCode, starts_at: first, ends_at: new Date(first.getTime() + days * DAY_MS) })
      .returning("id")
      .executeTakeFirstOrThrow();
    await trx
      .insertInto("programs")
      .values(
        PROGRAMS.map((p) => ({
          code: p.code,
          title: p.title,
          semester_id: semesterId,
          partner_id: partnerId.get(p.partner) ?? "",
          pi_user_id: uid(p.pi),
          rank: p.rank,
          allocated_hours: p.hours,
          category: p.category,
          too_allowed: p.too ?? false,
        })),
      )
      .execute();
    const programId = await idsByCode(trx, "programs");
    const observerLinks = PROGRAMS.flatMap((p) => p.observers.map((o) => ({ program_id: programId.get(p.code) ?? "", user_id: uid(o) })));
    await trx.insertInto("program_observers").values(observerLinks).execute();

    // Lay out each night as two or three blocks drawn from the science programs, with
    // some engineering and discretionary nights. ToO and payback blocks only come later.
    const random = prng(today.getTime() / DAY_MS);
    const science = PROGRAMS.filter((p) => p.category === "science" && !p.too);
    const pick = <T,>(list: T[]): T => list[Math.floor(random() * list.length)] as T;
    const blocks: Array<{ telescope_id: string; program_id: string; observer_user_id: string | null; instrument_id: string | null; kind: BlockKind; starts_at: Date; ends_at: Date }> = [];
    for (const t of TELESCOPES) {
      const site = SITES.find((s) => s.code === t.site);
      if (!site) continue;
      const tid = telescopeId.get(t.code) ?? "";
      const instruments = instrumentRows.filter((i) => i.telescope_id === tid).map((i) => i.id);
      for (const night of demoNights(site, first, days)) {
        const parts = random() < 0.5 ? 2 : 3;
        const length = night.end.getTime() - night.start.getTime();
        let start = night.start.getTime();
        for (let i = 0; i < parts; i++) {
          const end = i === parts - 1 ? night.end.getTime() : roundToQuarter(night.start.getTime() + ((i + 1) * length) / parts);
          const roll = random();
          const program = roll < 0.06 ? PROGRAMS.find((p) => p.code === "ENG-01") : roll < 0.12 ? PROGRAMS.find((p) => p.code === "DDT-01") : pick(science);
          if (program && end > start) {
            blocks.push({
              telescope_id: tid,
              program_id: programId.get(program.code) ?? "",
              observer_user_id: program.observers.length ? uid(pick(program.observers)) : null,
              instrument_id: instruments.length ? pick(instruments) : null,
              kind: program.category,
              starts_at: new Date(start),
              ends_at: new Date(end),
            });
          }
          start = end;
        }
      }
    }
    for (let i = 0; i < blocks.length; i += 500) await trx.insertInto("blocks").values(blocks.slice(i, i + 500)).execute();
    return { blocks: blocks.length, users: people.length };
  });
}
