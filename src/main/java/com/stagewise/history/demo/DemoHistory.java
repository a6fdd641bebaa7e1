package com.stagewise.history.demo;

import com.stagewise.history.HistoryStore;
import com.stagewise.history.ImportReport;
import com.stagewise.history.record.ActionKind;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.CaseNote;
import com.stagewise.history.record.CaseStatus;
import com.stagewise.history.record.HistoryBundle;
import com.stagewise.history.record.Outcome;
import com.stagewise.history.record.ReadingKind;
import com.stagewise.history.record.RepairAction;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StageSheetRecord;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.Unit;
import java.nio.charset.StandardCharsets;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.UUID;

/**
 * Invented demo data: a small bench that repairs mixing desks and lab power supplies from two
 * made-up makers, with a few units and closed cases, for the app's demo mode and the README.
 *
 * <p>Every name, serial number, owner and story here is invented. Ids are derived from fixed names,
 * so the demo history is the same on every bench and imports into itself without duplicates.
 */
public final class DemoHistory {
  /** The mixer board model's name. */
  public static final String MIXER = "Northfield MX-8 channel board";

  /** The power supply board model's name. */
  public static final String SUPPLY = "Harbour LP-3005 control board";

  /** An inverting line driver (gain -4.7) on ±15 V rails, with a dual op-amp. */
  static final String MIXER_STAGE =
      """
      {
        "format": "stagewise-stage", "version": 1,
        "title": "Channel line driver",
        "board": "Northfield MX-8 channel board",
        "ground": "GND",
        "rails": [ {"net": "VCC", "volts": 15, "tolerance": "5%"},
                   {"net": "VEE", "volts": -15, "tolerance": "5%"} ],
        "inputs": [ {"net": "IN", "dc": 1.0, "ac": 0.1, "hz": 1000} ],
        "parts": [
          {"ref": "R1", "kind": "resistor", "value": "10k", "tolerance": "1%", "nets": ["IN", "SUM"]},
          {"ref": "R2", "kind": "resistor", "value": "47k", "tolerance": "1%", "nets": ["SUM", "OUT"]}
        ],
        "amplifiers": [
          {"ref": "U1A", "package": "U1", "packageType": "dual-8", "section": "A",
           "class": "classic-bipolar",
           "inPlus": "GND", "inMinus": "SUM", "out": "OUT", "vPlus": "VCC", "vMinus": "VEE"}
        ]
      }
      """;

  /** A non-inverting amplifier (gain 2) of the supply's set-point, on ±12 V rails. */
  static final String SUPPLY_STAGE =
      """
      {
        "format": "stagewise-stage", "version": 1,
        "title": "Set-point amplifier",
        "board": "Harbour LP-3005 control board",
        "ground": "GND",
        "rails": [ {"net": "VCC", "volts": 12, "tolerance": "5%"},
                   {"net": "VEE", "volts": -12, "tolerance": "5%"} ],
        "inputs": [ {"net": "SET", "dc": 2.5} ],
        "parts": [
          {"ref": "R1", "kind": "resistor", "value": "10k", "tolerance": "1%", "nets": ["FB", "GND"]},
          {"ref": "R2", "kind": "resistor", "value": "10k", "tolerance": "1%", "nets": ["FB", "OUT"]}
        ],
        "amplifiers": [
          {"ref": "U2A", "package": "U2", "packageType": "dual-8", "section": "A",
           "class": "classic-bipolar",
           "inPlus": "SET", "inMinus": "FB", "out": "OUT", "vPlus": "VCC", "vMinus": "VEE"}
        ]
      }
      """;

  private static final Instant START = Instant.parse("2025-09-01T08:30:00Z");

  private DemoHistory() {}

  /**
   * Fills an empty history with the demo data and returns what was added.
   *
   * @throws IllegalStateException if the history is not empty (the demo never mixes with real work)
   */
  public static ImportReport fill(HistoryStore store) {
    if (!store.isEmpty()) {
      throw new IllegalStateException("the demo data goes into an empty history only");
    }
    return store.transfer().importBundle(bundle(), "demo data");
  }

  /** Returns the demo data as a bundle. */
  public static HistoryBundle bundle() {
    Builder b = new Builder();
    BoardModel mixer =
        b.model(
            MIXER,
            "Northfield Audio (invented maker)",
            "Eight-channel mixing desk; one board per channel.");
    BoardModel supply =
        b.model(SUPPLY, "Harbour Instruments (invented maker)", "Bench supply, 0-30 V 5 A.");
    b.sheet(mixer, "Channel line driver", MIXER_STAGE);
    b.sheet(supply, "Set-point amplifier", SUPPLY_STAGE);
    Unit hall = b.unit(mixer, "NF8-21037", "Riverside Community Hall (invented)");
    Unit studio = b.unit(mixer, "NF8-21502", "job 1184");
    Unit school = b.unit(mixer, "NF8-22019", "job 1207");
    Unit lab = b.unit(supply, "HI-3005-0412", "college electronics lab (invented)");
    Unit hobby = b.unit(supply, "HI-3005-0977", "job 1230");

    RepairCase c1 =
        b.closedCase(
            hall,
            0,
            "Channel 2 output stuck near -13 V, no signal through",
            3,
            Outcome.FIXED,
            "R2:open");
    b.dc(c1, "U1.8", 14.93);
    b.dc(c1, "U1.4", -14.97);
    b.dc(c1, "U1.2", 0.98);
    b.dc(c1, "U1.1", -13.52);
    b.action(
        c1,
        ActionKind.PART_REPLACED,
        "R2",
        "47k 1% (cracked)",
        "47k 1% metal film",
        "Hairline crack across the body.");
    b.note(
        c1,
        "Feedback resistor open: the stage ran open-loop and the output sat at its lower limit. Checked the other channels while the desk was open.");

    RepairCase c2 =
        b.closedCase(
            studio,
            12,
            "No sound from channel 5 line out; other channels fine",
            2,
            Outcome.FIXED,
            "U1A:dead");
    b.dc(c2, "U1.8", 15.02);
    b.dc(c2, "U1.4", -14.95);
    b.dc(c2, "U1.1", 0.0);
    b.action(
        c2,
        ActionKind.PART_REPLACED,
        "U1",
        "dual op-amp (original)",
        "dual op-amp, same type",
        "Socketed the new part.");
    b.note(c2, "Owner reports a speaker cable was shorted during a gig.");

    RepairCase c3 =
        b.closedCase(
            school,
            30,
            "Channel 1 dead, output sits at the negative rail",
            4,
            Outcome.FIXED,
            "R2:open");
    b.dc(c3, "U1.1", -13.47);
    b.action(c3, ActionKind.PART_REPLACED, "R2", "47k", "47k 1% metal film", "");
    b.action(c3, ActionKind.REFLOW, "U1", "", "", "Reflowed the op-amp's pins while there.");
    b.note(
        c3, "Same feedback resistor as on NF8-21037: worth checking on every MX-8 that comes in.");

    b.openCase(hall, 70, "Hum on the left bus after transport");

    RepairCase c4 =
        b.closedCase(lab, 20, "Output will not rise above about 2 V", 5, Outcome.FIXED, "VCC:low");
    b.dc(c4, "U2.8", 9.1);
    b.dc(c4, "U2.4", -11.9);
    b.action(
        c4,
        ActionKind.OTHER,
        "U5",
        "",
        "",
        "Replaced the +12 V regulator; the rail now reads 12.05 V.");
    b.note(c4, "Mains-powered: discharged the reservoir capacitors before ohms checks.");

    RepairCase c5 = b.closedCase(hobby, 41, "Dead: no display, no output", 1, Outcome.RETURNED);
    b.note(c5, "Quote declined by the owner; returned unrepaired.");

    return b.build();
  }

  /** Assembles the demo records with ids derived from fixed names. */
  private static final class Builder {
    private final List<BoardModel> models = new ArrayList<>();
    private final List<StageSheetRecord> sheets = new ArrayList<>();
    private final List<Unit> units = new ArrayList<>();
    private final List<RepairCase> cases = new ArrayList<>();
    private final List<StoredReading> readings = new ArrayList<>();
    private final List<RepairAction> actions = new ArrayList<>();
    private final List<CaseNote> notes = new ArrayList<>();
    private int serial;

    BoardModel model(String name, String maker, String notesText) {
      BoardModel m = new BoardModel(id("model " + name), name, maker, notesText, START);
      models.add(m);
      return m;
    }

    void sheet(BoardModel model, String title, String json) {
      sheets.add(
          new StageSheetRecord(
              id("sheet " + model.name() + title), model.id(), title, json, START));
    }

    Unit unit(BoardModel model, String serialNumber, String owner) {
      Unit u = new Unit(id("unit " + serialNumber), serialNumber, model.id(), owner, START);
      units.add(u);
      return u;
    }

    RepairCase closedCase(
        Unit unit, int day, String symptom, int days, Outcome outcome, String... faults) {
      Instant opened = START.plus(Duration.ofDays(day));
      Instant closed = opened.plus(Duration.ofDays(days));
      RepairCase c =
          new RepairCase(
              id("case " + unit.serial() + day),
              unit.id(),
              opened,
              symptom,
              CaseStatus.CLOSED,
              closed,
              outcome,
              List.of(faults),
              closed);
      cases.add(c);
      return c;
    }

    void openCase(Unit unit, int day, String symptom) {
      Instant opened = START.plus(Duration.ofDays(day));
      cases.add(
          new RepairCase(
              id("case " + unit.serial() + day),
              unit.id(),
              opened,
              symptom,
              CaseStatus.OPEN,
              null,
              null,
              List.of(),
              opened));
    }

    void dc(RepairCase c, String at, double volts) {
      Instant taken = c.openedAt().plus(Duration.ofMinutes(30 + readings.size()));
      readings.add(
          new StoredReading(
              id("reading " + c.id() + at),
              c.id(),
              at,
              ReadingKind.DC,
              volts,
              null,
              null,
              "6000-count handheld, ±(0.5 % + 2 counts)",
              taken));
    }

    void action(
        RepairCase c, ActionKind kind, String part, String oldValue, String newValue, String text) {
      Instant at = c.closedAt().minus(Duration.ofHours(2 + actions.size()));
      actions.add(
          new RepairAction(
              id("action " + c.id() + (serial++)),
              c.id(),
              at,
              kind,
              part,
              oldValue,
              newValue,
              text,
              at));
    }

    void note(RepairCase c, String text) {
      Instant at = c.openedAt().plus(Duration.ofHours(1 + notes.size()));
      notes.add(new CaseNote(id("note " + c.id() + (serial++)), c.id(), at, text, at));
    }

    HistoryBundle build() {
      return new HistoryBundle(
          HistoryBundle.CURRENT_VERSION,
          START,
          "demo",
          models,
          sheets,
          units,
          cases,
          readings,
          List.of(),
          actions,
          notes);
    }

    private static String id(String name) {
      return UUID.nameUUIDFromBytes(("stagewise demo " + name).getBytes(StandardCharsets.UTF_8))
          .toString();
    }
  }
}
