package com.stagewise.cli;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.ReadingSet;
import com.stagewise.circuit.Stage;
import com.stagewise.history.CaseFile;
import com.stagewise.history.DatabaseLocation;
import com.stagewise.history.ExportSelection;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.ImportReport;
import com.stagewise.history.SearchHit;
import com.stagewise.history.SearchQuery;
import com.stagewise.history.ShopMemory;
import com.stagewise.history.UnitHistory;
import com.stagewise.history.demo.DemoHistory;
import com.stagewise.history.demo.SyntheticHistory;
import com.stagewise.history.record.ActionKind;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.CaseNote;
import com.stagewise.history.record.CaseStatus;
import com.stagewise.history.record.HistoryBundle;
import com.stagewise.history.record.Outcome;
import com.stagewise.history.record.RepairAction;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StageSheetRecord;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.SuspectListRecord;
import com.stagewise.history.record.Unit;
import com.stagewise.interchange.ReadingsSheet;
import com.stagewise.interchange.StageSheet;
import com.stagewise.interchange.history.HistoryBundleJson;
import com.stagewise.interchange.history.HistoryJson;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/**
 * {@code stagewise history …}: the repair history from the command line: board models, units,
 * cases, readings, notes, actions, search, and moving the history between benches.
 *
 * <p>Every subcommand takes {@code --db FILE} (else {@code STAGEWISE_DB}, else the user's data
 * folder) and {@code --json}. Output is readable text by default.
 */
@Command(
    name = "history",
    mixinStandardHelpOptions = true,
    description = "Keep and search the repair history: units, cases, readings, notes, actions.",
    subcommands = {
      HistoryCommand.Models.class,
      HistoryCommand.AddModel.class,
      HistoryCommand.Units.class,
      HistoryCommand.AddUnit.class,
      HistoryCommand.OpenCase.class,
      HistoryCommand.CloseCase.class,
      HistoryCommand.AddReadings.class,
      HistoryCommand.AddNote.class,
      HistoryCommand.AddAction.class,
      HistoryCommand.Show.class,
      HistoryCommand.Search.class,
      HistoryCommand.Faults.class,
      HistoryCommand.Export.class,
      HistoryCommand.Import.class,
      HistoryCommand.Backup.class,
      HistoryCommand.Restore.class,
      HistoryCommand.Demo.class,
      HistoryCommand.MakeTestData.class
    })
final class HistoryCommand implements Runnable {
  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Override
  public void run() {
    throw new CommandLine.ParameterException(
        spec.commandLine(), "Name a history command, e.g. 'history units' (see 'history --help').");
  }

  /** The options every history subcommand has. */
  static final class Common {
    @Option(
        names = "--db",
        paramLabel = "FILE",
        description = "The history database (default: $STAGEWISE_DB, else the data folder).")
    Path db;

    @Option(names = "--json", description = "Print JSON instead of text.")
    boolean json;

    @CommandLine.Spec(CommandLine.Spec.Target.MIXEE)
    CommandLine.Model.CommandSpec spec;

    HistoryStore open() {
      return HistoryStore.open(DatabaseLocation.resolve(db));
    }

    PrintWriter out() {
      return spec.commandLine().getOut();
    }
  }

  /** A history subcommand: opens the store, runs, closes it, and returns the exit code. */
  abstract static class Base implements Callable<Integer> {
    @Mixin Common common;

    @Override
    public final Integer call() {
      try (HistoryStore store = common.open()) {
        run(store, common.out());
      }
      common.out().flush();
      return ExitCode.OK;
    }

    abstract void run(HistoryStore store, PrintWriter out);

    boolean json() {
      return common.json;
    }
  }

  // ---- board models and units ----------------------------------------------------------------

  @Command(name = "models", description = "List the board models.")
  static final class Models extends Base {
    @Override
    void run(HistoryStore store, PrintWriter out) {
      List<BoardModel> models = store.units().boardModels();
      if (json()) {
        out.println(HistoryJson.boardModels(models));
        return;
      }
      if (models.isEmpty()) {
        out.println("No board models yet. Add one with 'history add-model --name NAME'.");
      }
      for (BoardModel m : models) {
        int sheets = store.library().sheets(m.id()).size();
        out.println(
            m.name()
                + (m.maker().isEmpty() ? "" : "  (" + m.maker() + ")")
                + "  "
                + plural(sheets, "stage sheet"));
      }
    }
  }

  @Command(name = "add-model", description = "Add a board model, optionally with its stage sheets.")
  static final class AddModel extends Base {
    @Option(names = "--name", required = true, description = "The board model's name.")
    String name;

    @Option(names = "--maker", defaultValue = "", description = "Its maker.")
    String maker;

    @Option(
        names = "--stage",
        paramLabel = "FILE",
        description = "A stage sheet (*.stage.json) to keep with it; repeatable.")
    List<Path> stages = new ArrayList<>();

    @Override
    void run(HistoryStore store, PrintWriter out) {
      // Read every sheet first, so that a bad one adds nothing.
      Map<String, String> sheets = new LinkedHashMap<>();
      for (Path file : stages) {
        String text = readText(file);
        Stage stage = StageSheet.read(text, file.toString());
        sheets.put(stage.title().isBlank() ? file.getFileName().toString() : stage.title(), text);
      }
      BoardModel model = store.units().boardModel(name, maker);
      for (Map.Entry<String, String> sheet : sheets.entrySet()) {
        store.library().add(model.id(), sheet.getKey(), sheet.getValue());
      }
      if (json()) {
        out.println(HistoryJson.boardModels(List.of(model)));
      } else {
        out.println(
            "Board model "
                + model.name()
                + " ("
                + plural(store.library().sheets(model.id()).size(), "stage sheet")
                + ").");
      }
    }
  }

  @Command(name = "units", description = "List the units, of one board model or all.")
  static final class Units extends Base {
    @Option(names = "--model", description = "Only units of this board model.")
    String model;

    @Override
    void run(HistoryStore store, PrintWriter out) {
      String modelId = model == null ? null : requireModel(store, model).id();
      List<Unit> units = store.units().list(modelId);
      Map<String, BoardModel> models = modelsById(store);
      if (json()) {
        out.println(HistoryJson.units(units, models));
        return;
      }
      if (units.isEmpty()) {
        out.println("No units yet. Add one with 'history add-unit --serial S --model M'.");
      }
      for (Unit u : units) {
        out.println(
            u.serial()
                + "  "
                + models.get(u.boardModelId()).name()
                + (u.owner().isEmpty() ? "" : "  " + u.owner()));
      }
    }
  }

  @Command(name = "add-unit", description = "Add a unit (the board model is added too if new).")
  static final class AddUnit extends Base {
    @Option(
        names = "--serial",
        required = true,
        description = "The serial number as written on the unit.")
    String serial;

    @Option(names = "--model", required = true, description = "Its board model.")
    String model;

    @Option(names = "--owner", defaultValue = "", description = "The owner or job reference.")
    String owner;

    @Override
    void run(HistoryStore store, PrintWriter out) {
      BoardModel boardModel =
          store.units().findBoardModel(model).orElseGet(() -> store.units().boardModel(model, ""));
      Unit unit = store.units().add(serial, boardModel.id(), owner);
      out.println(
          json()
              ? HistoryJson.unit(unit, boardModel)
              : "Unit " + unit.serial() + " of " + boardModel.name() + " added.");
    }
  }

  // ---- cases ----------------------------------------------------------------------------------

  @Command(
      name = "open-case",
      description = "Open a case for a unit, with the symptom as reported.")
  static final class OpenCase extends Base {
    @Option(names = "--serial", required = true, description = "The unit's serial number.")
    String serial;

    @Option(
        names = "--model",
        description = "Its board model (needed if two models have this serial).")
    String model;

    @Option(names = "--symptom", required = true, description = "The symptom as reported.")
    String symptom;

    @Override
    void run(HistoryStore store, PrintWriter out) {
      Unit unit = requireUnit(store, serial, model);
      RepairCase opened = store.cases().open(unit.id(), symptom);
      out.println(
          json()
              ? HistoryJson.repairCase(opened)
              : "Case " + shortId(opened.id()) + " opened for " + unit.serial() + ".");
    }
  }

  @Command(name = "close-case", description = "Close out a case: its outcome and the faults found.")
  static final class CloseCase extends Base {
    @Option(
        names = "--case",
        required = true,
        paramLabel = "ID",
        description = "The case id (or its first characters).")
    String caseId;

    @Option(names = "--outcome", required = true, description = "fixed, not-fixed or returned.")
    String outcome;

    @Option(
        names = "--fault",
        paramLabel = "FAULT",
        description = "A fault found to be wrong, e.g. R2:open; repeatable.")
    List<String> faults = new ArrayList<>();

    @Option(names = "--note", description = "A closing note.")
    String note;

    @Override
    void run(HistoryStore store, PrintWriter out) {
      Outcome how =
          Outcome.fromWord(outcome)
              .orElseThrow(
                  () ->
                      new InvalidInputException(
                          "command line",
                          "--outcome",
                          "expected fixed, not-fixed or returned, got '" + outcome + "'"));
      String id = store.cases().resolveId(caseId);
      RepairCase closed = store.cases().close(id, how, faults);
      if (note != null && !note.isBlank()) {
        store.cases().addNote(id, note);
      }
      out.println(
          json()
              ? HistoryJson.repairCase(closed)
              : "Case "
                  + shortId(id)
                  + " closed: "
                  + how.word()
                  + (faults.isEmpty() ? "" : ", found " + String.join(", ", faults))
                  + ".");
    }
  }

  @Command(
      name = "add-readings",
      description = "Store a readings file in a case, with the diagnosis computed from it.")
  static final class AddReadings extends Base {
    @Option(
        names = "--case",
        required = true,
        paramLabel = "ID",
        description = "The case id (or its first characters).")
    String caseId;

    @Option(
        names = "--readings",
        required = true,
        paramLabel = "FILE",
        description = "The readings file (*.readings.json).")
    Path readings;

    @Option(
        names = "--stage",
        paramLabel = "FILE",
        description =
            "The stage sheet the readings were taken on (default: the board model's stored sheet).")
    Path stageFile;

    @Option(
        names = "--sheet",
        paramLabel = "TITLE",
        description = "Which of the board model's stored sheets, if it has several.")
    String sheetTitle;

    @Option(
        names = "--top",
        defaultValue = "12",
        description = "The most suspects to keep (default ${DEFAULT-VALUE}).")
    int top;

    @Override
    void run(HistoryStore store, PrintWriter out) {
      String id = store.cases().resolveId(caseId);
      RepairCase repairCase = store.cases().find(id).orElseThrow();
      Unit unit = store.units().find(repairCase.unitId()).orElseThrow();
      BoardModel model = store.units().findBoardModel(unit.boardModelId()).orElseThrow();
      Stage stage = stage(store, model);
      ReadingSet set = ReadingsSheet.read(readings, stage);
      Instant now = Instant.now();
      List<StoredReading> stored = CaseReadings.toStored(set, id, now);
      Map<String, Integer> counts = new ShopMemory(store).faultCounts(model.id());
      SuspectListRecord suspects =
          CaseReadings.diagnose(stage, set, counts, top, id, now, programVersion());
      store.cases().addReadings(id, stored, suspects);
      if (json()) {
        out.println(HistoryJson.storedReadings(stored, suspects));
        return;
      }
      out.println(plural(stored.size(), "reading") + " stored in case " + shortId(id) + ".");
      out.println("Verdict: " + suspects.verdict());
      suspects.suspects().forEach(s -> out.println(CaseReadings.suspectLine(s, counts)));
      if (!suspects.nextProbes().isEmpty()) {
        out.println("Next probes:");
        suspects.nextProbes().lines().forEach(line -> out.println("  " + line));
      }
    }

    private Stage stage(HistoryStore store, BoardModel model) {
      if (stageFile != null) {
        return StageSheet.read(stageFile);
      }
      List<StageSheetRecord> sheets = store.library().sheets(model.id());
      if (sheetTitle != null) {
        sheets =
            sheets.stream().filter(s -> s.title().equalsIgnoreCase(sheetTitle.strip())).toList();
      }
      if (sheets.size() != 1) {
        throw new InvalidInputException(
            "command line",
            sheetTitle == null ? "--stage" : "--sheet",
            sheets.isEmpty()
                ? "board model "
                    + model.name()
                    + " has no stored stage sheet"
                    + (sheetTitle == null ? "" : " titled '" + sheetTitle + "'")
                    + "; give the stage sheet with --stage FILE"
                : "board model "
                    + model.name()
                    + " has several stage sheets; choose one with --sheet TITLE");
      }
      StageSheetRecord sheet = sheets.get(0);
      return StageSheet.read(
          sheet.sheetJson(), "stage sheet '" + sheet.title() + "' of " + model.name());
    }
  }

  @Command(name = "add-note", description = "Add a time-stamped note to a case.")
  static final class AddNote extends Base {
    @Option(
        names = "--case",
        required = true,
        paramLabel = "ID",
        description = "The case id (or its first characters).")
    String caseId;

    @Option(names = "--text", required = true, description = "The note.")
    String text;

    @Override
    void run(HistoryStore store, PrintWriter out) {
      CaseNote note = store.cases().addNote(store.cases().resolveId(caseId), text);
      out.println(
          json() ? HistoryJson.note(note) : "Note added to case " + shortId(note.caseId()) + ".");
    }
  }

  @Command(
      name = "add-action",
      description = "Record what was done: a part replaced, a reflow, an adjustment.")
  static final class AddAction extends Base {
    @Option(
        names = "--case",
        required = true,
        paramLabel = "ID",
        description = "The case id (or its first characters).")
    String caseId;

    @Option(
        names = "--kind",
        required = true,
        description = "part-replaced, reflow, adjustment or other.")
    String kind;

    @Option(
        names = "--part",
        defaultValue = "",
        description = "The part designator, e.g. R2 or U1.")
    String part;

    @Option(names = "--old", defaultValue = "", description = "The old value or part number.")
    String oldValue;

    @Option(names = "--new", defaultValue = "", description = "The new value or part number.")
    String newValue;

    @Option(names = "--text", defaultValue = "", description = "What was done, in words.")
    String text;

    @Override
    void run(HistoryStore store, PrintWriter out) {
      ActionKind what =
          ActionKind.fromWord(kind)
              .orElseThrow(
                  () ->
                      new InvalidInputException(
                          "command line",
                          "--kind",
                          "expected part-replaced, reflow, adjustment or other, got '"
                              + kind
                              + "'"));
      RepairAction action =
          store
              .cases()
              .addAction(store.cases().resolveId(caseId), what, part, oldValue, newValue, text);
      out.println(
          json()
              ? HistoryJson.action(action)
              : "Action recorded in case " + shortId(action.caseId()) + ".");
    }
  }

  // ---- looking things up ----------------------------------------------------------------------

  @Command(name = "show", description = "Show a unit's whole history, or one case.")
  static final class Show extends Base {
    @Option(names = "--serial", description = "The unit's serial number.")
    String serial;

    @Option(
        names = "--model",
        description = "Its board model (needed if two models have this serial).")
    String model;

    @Option(
        names = "--case",
        paramLabel = "ID",
        description = "One case (its id or first characters).")
    String caseId;

    @Override
    void run(HistoryStore store, PrintWriter out) {
      if ((serial == null) == (caseId == null)) {
        throw new InvalidInputException(
            "command line", "--serial/--case", "give either --serial or --case");
      }
      if (caseId != null) {
        CaseFile file = store.cases().caseFile(store.cases().resolveId(caseId)).orElseThrow();
        out.println(json() ? HistoryJson.caseFile(file) : HistoryText.caseFile(file));
        return;
      }
      Unit unit = requireUnit(store, serial, model);
      UnitHistory history = store.cases().unitHistory(unit.id()).orElseThrow();
      out.print(
          json()
              ? HistoryJson.unitHistory(history) + System.lineSeparator()
              : HistoryText.unitHistory(history));
    }
  }

  @Command(
      name = "search",
      description = "Find cases by serial, board model, fault, part, status, dates and words.")
  static final class Search extends Base {
    @Option(names = "--serial", description = "The unit's serial number (exact, any letter case).")
    String serial;

    @Option(names = "--model", description = "The board model.")
    String model;

    @Option(names = "--fault", description = "A confirmed fault id, e.g. R2:open.")
    String fault;

    @Option(
        names = "--part",
        description = "A part named by a confirmed fault or an action, e.g. R2 or U1.")
    String part;

    @Option(names = "--status", description = "open or closed.")
    String status;

    @Option(
        names = "--from",
        paramLabel = "DATE",
        description = "Opened on or after this date (2026-03-01, UTC) or time.")
    String from;

    @Option(
        names = "--to",
        paramLabel = "DATE",
        description = "Opened on or before this date (UTC, the whole day) or before this time.")
    String to;

    @Option(names = "--text", description = "Words to find in symptoms and notes.")
    String text;

    @Option(
        names = "--limit",
        defaultValue = "50",
        description = "The most cases to list (default ${DEFAULT-VALUE}).")
    int limit;

    @Override
    void run(HistoryStore store, PrintWriter out) {
      if (limit < 1) {
        throw new InvalidInputException(
            "command line", "--limit", "expected 1 or more, got " + limit);
      }
      SearchQuery query =
          SearchQuery.all()
              .withSerial(serial)
              .withBoardModel(model)
              .withFaultId(fault)
              .withPart(part)
              .withText(text)
              .withLimit(limit);
      if (status != null) {
        query =
            query.withStatus(
                CaseStatus.fromWord(status)
                    .orElseThrow(
                        () ->
                            new InvalidInputException(
                                "command line",
                                "--status",
                                "expected open or closed, got '" + status + "'")));
      }
      if (from != null) {
        query = query.withOpenedFrom(time("--from", from, false));
      }
      if (to != null) {
        query = query.withOpenedBefore(time("--to", to, true));
      }
      List<SearchHit> hits = store.cases().search(query);
      out.print(json() ? HistoryJson.hits(hits) + System.lineSeparator() : HistoryText.hits(hits));
    }
  }

  @Command(
      name = "faults",
      description = "Show the faults confirmed on a board model's fixed cases (the shop's memory).")
  static final class Faults extends Base {
    @Option(names = "--model", required = true, description = "The board model.")
    String model;

    @Override
    void run(HistoryStore store, PrintWriter out) {
      BoardModel boardModel = requireModel(store, model);
      Map<String, Integer> counts = new ShopMemory(store).faultCounts(boardModel.id());
      if (json()) {
        out.println(HistoryJson.faultCounts(boardModel.name(), counts));
        return;
      }
      if (counts.isEmpty()) {
        out.println("No fixed cases with a confirmed fault on " + boardModel.name() + " yet.");
      }
      counts.forEach(
          (fault, n) -> out.println(fault + "  " + ShopMemory.hint(fault, counts).orElse("")));
    }
  }

  // ---- between benches ------------------------------------------------------------------------

  @Command(name = "export", description = "Write the history, or a part of it, to one JSON bundle.")
  static final class Export extends Base {
    @Option(
        names = "--out",
        required = true,
        paramLabel = "FILE",
        description = "The bundle file to write.")
    Path file;

    @Option(names = "--serial", description = "Only this unit.")
    String serial;

    @Option(
        names = "--model",
        description = "Only this board model (or, with --serial, the unit's model).")
    String model;

    @Option(
        names = "--from",
        paramLabel = "DATE",
        description = "Only cases opened on or after this date (UTC).")
    String from;

    @Option(
        names = "--to",
        paramLabel = "DATE",
        description = "Only cases opened on or before this date (UTC).")
    String to;

    @Override
    void run(HistoryStore store, PrintWriter out) {
      ExportSelection selection;
      if (serial != null) {
        selection = new ExportSelection.OneUnit(requireUnit(store, serial, model).id());
      } else if (model != null) {
        selection = new ExportSelection.OneBoardModel(requireModel(store, model).id());
      } else if (from != null || to != null) {
        selection =
            new ExportSelection.OpenedBetween(
                from == null ? Instant.EPOCH : time("--from", from, false),
                to == null ? Instant.parse("9999-12-31T00:00:00Z") : time("--to", to, true));
      } else {
        selection = new ExportSelection.All();
      }
      HistoryBundle bundle = store.transfer().export(selection, programVersion());
      HistoryBundleJson.write(bundle, file);
      if (json()) {
        out.println(
            HistoryJson.fields(
                Map.of(
                    "bundle", file.toString(), "cases", Integer.toString(bundle.cases().size()))));
      } else {
        out.println(
            "Exported "
                + plural(bundle.cases().size(), "case")
                + " of "
                + plural(bundle.units().size(), "unit")
                + " ("
                + plural(bundle.size(), "record")
                + ") to "
                + file
                + ".");
      }
    }
  }

  @Command(
      name = "import",
      description = "Merge a JSON bundle into the history (all of it or nothing).")
  static final class Import extends Base {
    @CommandLine.Parameters(paramLabel = "FILE", description = "The bundle file.")
    Path file;

    @Override
    void run(HistoryStore store, PrintWriter out) {
      HistoryBundle bundle = HistoryBundleJson.read(file);
      ImportReport report = store.transfer().importBundle(bundle, file.toString());
      out.print(
          json()
              ? HistoryJson.importReport(report) + System.lineSeparator()
              : HistoryText.importReport(report));
    }
  }

  @Command(
      name = "backup",
      description =
          "Write a consistent copy of the history to a new file (safe while the app runs).")
  static final class Backup extends Base {
    @Option(
        names = "--out",
        required = true,
        paramLabel = "FILE",
        description = "The backup file (must not exist).")
    Path file;

    @Override
    void run(HistoryStore store, PrintWriter out) {
      store.transfer().backupTo(file);
      out.println(
          json()
              ? HistoryJson.fields(Map.of("backup", file.toString()))
              : "Backup written to " + file + ".");
    }
  }

  @Command(
      name = "restore",
      description = "Replace the history with a backup (the current one is saved first).")
  static final class Restore extends Base {
    @Option(
        names = "--from",
        required = true,
        paramLabel = "FILE",
        description = "The backup file.")
    Path file;

    @Override
    void run(HistoryStore store, PrintWriter out) {
      Path saved = store.transfer().restoreFrom(file);
      out.println(
          json()
              ? HistoryJson.fields(
                  Map.of("restoredFrom", file.toString(), "previousSavedTo", saved.toString()))
              : "History restored from "
                  + file
                  + ". The previous history was saved to "
                  + saved
                  + ".");
    }
  }

  @Command(name = "demo", description = "Fill an empty history with invented demo units and cases.")
  static final class Demo extends Base {
    @Override
    void run(HistoryStore store, PrintWriter out) {
      if (!store.isEmpty()) {
        throw new InvalidInputException(
            "command line",
            "--db",
            "the demo data goes into an empty history only; choose a new file with --db");
      }
      ImportReport report = DemoHistory.fill(store);
      out.println(
          json()
              ? HistoryJson.importReport(report)
              : "Demo history added ("
                  + plural(report.added(), "record")
                  + "); all of it is invented.");
    }
  }

  @Command(
      name = "make-test-data",
      description = "Fill a history with generated cases, for the speed benchmark.")
  static final class MakeTestData extends Base {
    @Option(
        names = "--cases",
        defaultValue = "100000",
        description = "Cases to generate (default ${DEFAULT-VALUE}).")
    int cases;

    @Option(
        names = "--readings-per-case",
        defaultValue = "10",
        description = "Readings per case (default ${DEFAULT-VALUE}).")
    int readingsPerCase;

    @Option(
        names = "--seed",
        defaultValue = "1",
        description = "Random seed (default ${DEFAULT-VALUE}).")
    long seed;

    @Override
    void run(HistoryStore store, PrintWriter out) {
      if (cases < 1 || readingsPerCase < 0) {
        throw new InvalidInputException(
            "command line", "--cases", "expected 1 or more cases and 0 or more readings per case");
      }
      long started = System.nanoTime();
      SyntheticHistory.fill(store, cases, readingsPerCase, seed, 2_000);
      double seconds = (System.nanoTime() - started) / 1e9;
      out.println(
          String.format(
              java.util.Locale.ROOT,
              "Generated %d cases with %d readings each in %.1f s.",
              cases,
              readingsPerCase,
              seconds));
    }
  }

  // ---- helpers ----------------------------------------------------------------------------------

  static BoardModel requireModel(HistoryStore store, String name) {
    return store
        .units()
        .findBoardModel(name)
        .orElseThrow(
            () ->
                new InvalidInputException(
                    "command line",
                    "--model",
                    "no board model named '" + name + "' (see 'history models')"));
  }

  static Unit requireUnit(HistoryStore store, String serial, String model) {
    List<Unit> units = store.units().bySerial(serial);
    if (model != null) {
      String modelId = requireModel(store, model).id();
      units = units.stream().filter(u -> u.boardModelId().equals(modelId)).toList();
    }
    if (units.isEmpty()) {
      throw new InvalidInputException(
          "command line",
          "--serial",
          "no unit with serial '"
              + serial
              + "'"
              + (model == null ? "" : " of " + model)
              + " (add it with 'history add-unit')");
    }
    if (units.size() > 1) {
      throw new InvalidInputException(
          "command line",
          "--model",
          "several board models have a unit with serial '"
              + serial
              + "'; name the model with --model");
    }
    return units.get(0);
  }

  static Map<String, BoardModel> modelsById(HistoryStore store) {
    Map<String, BoardModel> models = new LinkedHashMap<>();
    store.units().boardModels().forEach(m -> models.put(m.id(), m));
    return models;
  }

  /**
   * Returns a date (UTC; as an upper bound, the end of that day) or a UTC time given on the command
   * line.
   */
  static Instant time(String option, String text, boolean endOfDay) {
    try {
      LocalDate date = LocalDate.parse(text.strip());
      return (endOfDay ? date.plusDays(1) : date).atStartOfDay(ZoneOffset.UTC).toInstant();
    } catch (DateTimeParseException notADate) {
      try {
        return Instant.parse(text.strip());
      } catch (DateTimeParseException e) {
        throw new InvalidInputException(
            "command line",
            option,
            "expected a date such as 2026-03-01 or a UTC time such as 2026-03-01T14:30:00Z, got '"
                + text
                + "'");
      }
    }
  }

  static String shortId(String id) {
    return id.substring(0, Math.min(8, id.length()));
  }

  static String plural(int n, String word) {
    return n + " " + word + (n == 1 ? "" : "s");
  }

  static String programVersion() {
    String version = HistoryCommand.class.getPackage().getImplementationVersion();
    return version == null ? "development build" : version;
  }

  private static String readText(Path file) {
    try {
      return Files.readString(file, StandardCharsets.UTF_8);
    } catch (IOException e) {
      throw new InvalidInputException(
          file.toString(), "", "cannot read the file: " + e.getMessage());
    }
  }
}
