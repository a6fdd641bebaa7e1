package com.stagewise.ui.history;

import com.stagewise.circuit.value.Engineering;
import com.stagewise.history.CaseFile;
import com.stagewise.history.SearchHit;
import com.stagewise.history.SearchQuery;
import com.stagewise.history.UnitHistory;
import com.stagewise.history.record.AfterRepairReading;
import com.stagewise.history.record.CaseNote;
import com.stagewise.history.record.CasePhoto;
import com.stagewise.history.record.CaseStatus;
import com.stagewise.history.record.ReadingKind;
import com.stagewise.history.record.RepairAction;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.StoredSuspect;
import com.stagewise.history.record.SuspectListRecord;
import com.stagewise.ui.Bench;
import com.stagewise.ui.PhotoAttaching;
import com.stagewise.ui.ReportSaving;
import com.stagewise.ui.words.Words;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import javafx.beans.property.ObjectProperty;
import javafx.beans.property.SimpleObjectProperty;
import javafx.beans.property.SimpleStringProperty;
import javafx.beans.property.StringProperty;
import javafx.collections.FXCollections;
import javafx.collections.ObservableList;

/**
 * The history screen: search the cases (by serial, board model, fault, part or words), see a unit's
 * timeline, and a case as it was: readings, the suspect list at the time, actions, notes.
 */
public final class HistoryViewModel {
  private final Bench bench;
  private final StringProperty query = new SimpleStringProperty("");
  private final ObjectProperty<Field> field = new SimpleObjectProperty<>(Field.ANY);
  private final ObservableList<SearchHit> hits = FXCollections.observableArrayList();
  private final StringProperty hitsNote = new SimpleStringProperty("");
  private final ObjectProperty<CaseView> shown = new SimpleObjectProperty<>();
  private final ObservableList<String> timeline = FXCollections.observableArrayList();
  private final StringProperty reportNote = new SimpleStringProperty("");
  private final ObservableList<ShownPhoto> photos = FXCollections.observableArrayList();
  private final ObservableList<String> afterRepair = FXCollections.observableArrayList();
  private final ObjectProperty<ShownPhoto> enlarged = new SimpleObjectProperty<>();
  private String shownSerial = "";

  /** Creates the history screen's model on a bench. */
  public HistoryViewModel(Bench bench) {
    this.bench = bench;
  }

  /** What the search words are matched against. */
  public enum Field {
    ANY("Words"),
    SERIAL("Serial"),
    BOARD("Board model"),
    FAULT("Fault"),
    PART("Part");

    private final String label;

    Field(String label) {
      this.label = label;
    }

    /** Returns the field's name on its button. */
    public String label() {
      return label;
    }
  }

  /**
   * A case as it was, in lines of text a technician reads.
   *
   * @param caseId the case's id
   * @param title unit, board model and date
   * @param symptom the reported symptom
   * @param status "open", or the outcome with the date closed
   * @param faults the faults found, in words
   * @param readings the readings in the order taken
   * @param suspects the last suspect list at the time, first suspect first
   * @param actions what was done
   * @param notes the notes with their times
   */
  public record CaseView(
      String caseId,
      String title,
      String symptom,
      String status,
      String faults,
      List<String> readings,
      List<String> suspects,
      List<String> actions,
      List<String> notes) {}

  /**
   * A photo of the board as the history screen shows it.
   *
   * @param id the photo's id
   * @param caption its file name, size and when and by whom it was attached
   * @param image the picture file's bytes (PNG or JPEG)
   */
  public record ShownPhoto(String id, String caption, byte[] image) {}

  /**
   * Returns the shown case's readings taken again after the repair, each with its healthy band and
   * whether it is inside, in the order taken (kept apart from the readings of the fault).
   */
  public ObservableList<String> afterRepair() {
    return afterRepair;
  }

  /** Returns the shown case's photos of the board, in the order attached. */
  public ObservableList<ShownPhoto> photos() {
    return photos;
  }

  /** The photo shown large over the case (tapped on its thumbnail), or null. */
  public ObjectProperty<ShownPhoto> enlargedProperty() {
    return enlarged;
  }

  /** Shows a photo large. */
  public void enlarge(ShownPhoto photo) {
    enlarged.set(photo);
  }

  /** Goes back from the large photo to the case. */
  public void closeEnlarged() {
    enlarged.set(null);
  }

  /**
   * Asks which photo of the board to attach to the shown case (PNG or JPEG), stores it and shows
   * the case again with it.
   */
  public void attachPhoto() {
    CaseView view = shown.get();
    if (view != null) {
      PhotoAttaching.attach(bench, view.caseId(), photo -> show(view.caseId()));
    }
  }

  public StringProperty queryProperty() {
    return query;
  }

  public ObjectProperty<Field> fieldProperty() {
    return field;
  }

  public ObservableList<SearchHit> hits() {
    return hits;
  }

  public StringProperty hitsNoteProperty() {
    return hitsNote;
  }

  public ObjectProperty<CaseView> shownProperty() {
    return shown;
  }

  public ObservableList<String> timeline() {
    return timeline;
  }

  /** Says where the shown case's report was saved, once it is. */
  public StringProperty reportNoteProperty() {
    return reportNote;
  }

  /** Asks where to save the shown case's repair report (PDF) and saves it there. */
  public void saveReport() {
    CaseView view = shown.get();
    if (view != null) {
      ReportSaving.save(bench, view.caseId(), shownSerial, reportNote::set);
    }
  }

  /** Searches the cases; an empty search lists the newest cases. */
  public void search() {
    String words = query.get() == null ? "" : query.get().strip();
    SearchQuery q = SearchQuery.all();
    if (!words.isEmpty()) {
      q =
          switch (field.get()) {
            case ANY -> q.withText(words);
            case SERIAL -> q.withSerial(words);
            case BOARD -> q.withBoardModel(words);
            case FAULT -> q.withFaultId(words);
            case PART -> q.withPart(words.toUpperCase(Locale.ROOT));
          };
    }
    SearchQuery finalQuery = q;
    bench
        .tasks()
        .run(
            "Searching the history",
            () -> bench.store().cases().search(finalQuery),
            found -> {
              hits.setAll(found);
              hitsNote.set(
                  found.isEmpty()
                      ? (words.isEmpty()
                          ? "No cases yet."
                          : "No case matches. Try fewer words or another field.")
                      : found.size() == 1
                          ? "1 case."
                          : found.size()
                              + " cases"
                              + (found.size() >= SearchQuery.DEFAULT_LIMIT
                                  ? " (the first " + found.size() + ")."
                                  : "."));
            },
            e ->
                bench
                    .problems()
                    .failed(
                        "Could not search the history",
                        e,
                        field.get() == Field.FAULT
                            ? "Type a fault as the suspects show it in short form, e.g. R2:open."
                            : Words.CHECK_DATABASE));
  }

  /** Shows one case as it was, with its unit's timeline. */
  public void show(String caseId) {
    bench
        .tasks()
        .run(
            "Reading the case",
            () -> {
              CaseFile file =
                  bench
                      .store()
                      .cases()
                      .caseFile(caseId)
                      .orElseThrow(
                          () ->
                              new IllegalStateException(
                                  "the case " + caseId + " is not in the history"));
              UnitHistory unit =
                  bench.store().cases().unitHistory(file.repairCase().unitId()).orElseThrow();
              List<ShownPhoto> pictures = new ArrayList<>();
              for (CasePhoto p : file.photos()) {
                bench
                    .store()
                    .cases()
                    .photo(p.id())
                    .ifPresent(
                        stored ->
                            pictures.add(
                                new ShownPhoto(p.id(), Words.photoLine(p), stored.image())));
              }
              return new Loaded(file, unit, pictures);
            },
            loaded -> {
              shownSerial = loaded.unit().unit().serial();
              reportNote.set("");
              enlarged.set(null);
              photos.setAll(loaded.photos());
              afterRepair.setAll(afterRepairLines(loaded.file()));
              shown.set(view(loaded.file(), loaded.unit()));
              timeline.setAll(timeline(loaded.unit()));
            },
            e -> bench.problems().failed("Could not read the case", e, Words.CHECK_DATABASE));
  }

  private record Loaded(CaseFile file, UnitHistory unit, List<ShownPhoto> photos) {}

  /**
   * Returns the readings after the repair as lines, each with its kind as the close-out names it:
   * "U1 pin 1: −4.710 V …", "U1 pin 1 (AC volts RMS at 1 kHz): 0.720 V …", "U1 pin 2 to SUM (power
   * off): 46.8 kΩ …".
   */
  static List<String> afterRepairLines(CaseFile file) {
    List<String> lines = new ArrayList<>();
    for (AfterRepairReading r : file.afterRepair()) {
      boolean ohms = r.kind() == ReadingKind.OHMS;
      String point =
          switch (r.kind()) {
            case DC -> Words.pin(r.at());
            case AC -> Words.pin(r.at()) + " (" + Words.acVolts(r.measure(), r.hz()) + ")";
            case OHMS -> Words.pin(r.at()) + " to " + Words.pin(r.to()) + " (power off)";
          };
      String band =
          !r.hasBand()
              ? ""
              : ohms
                  ? Words.ohmsBand(r.healthyLow(), r.healthyHigh())
                  : Words.band(r.healthyLow(), r.healthyHigh());
      lines.add(
          point
              + ":  "
              + (ohms ? Words.ohms(r.value()) : Words.measured(r.value()))
              + "   "
              + (!r.hasBand()
                  ? "no healthy band known"
                  : (r.inside() ? "inside" : "OUTSIDE") + " the healthy band " + band)
              + "   ("
              + Words.dateTime(r.takenAt())
              + ")");
    }
    return lines;
  }

  static List<String> timeline(UnitHistory unit) {
    List<String> lines = new ArrayList<>();
    for (CaseFile f : unit.cases()) {
      RepairCase rc = f.repairCase();
      String end =
          rc.status() == CaseStatus.OPEN
              ? "still open"
              : Words.outcome(rc.outcome()) + " " + Words.date(rc.closedAt());
      String found =
          rc.confirmedFaults().isEmpty()
              ? ""
              : " — found "
                  + String.join(", ", rc.confirmedFaults().stream().map(Words::fault).toList());
      lines.add(Words.date(rc.openedAt()) + "  " + rc.symptom() + "  (" + end + ")" + found);
    }
    return lines;
  }

  static CaseView view(CaseFile file, UnitHistory unit) {
    RepairCase rc = file.repairCase();
    String title =
        "Unit "
            + unit.unit().serial()
            + " ("
            + unit.boardModel().name()
            + "), opened "
            + Words.dateTime(rc.openedAt());
    String status =
        rc.status() == CaseStatus.OPEN
            ? "Still open"
            : "Closed " + Words.dateTime(rc.closedAt()) + ": " + Words.outcome(rc.outcome());
    String faults = String.join(", ", rc.confirmedFaults().stream().map(Words::fault).toList());
    List<String> readings = new ArrayList<>();
    for (StoredReading r : file.readings()) {
      if (r.kind() == ReadingKind.OHMS) {
        // A power-off reading: between two points, in ohms or OL.
        readings.add(
            Words.pin(r.at())
                + " to "
                + Words.pin(r.to())
                + ":  "
                + (r.isOverRange() ? "OL" : Engineering.of(r.value(), "Ω", 4))
                + " (power off)   ("
                + Words.dateTime(r.takenAt())
                + ")");
        continue;
      }
      readings.add(
          Words.pin(r.at())
              + ":  "
              + Words.measured(r.value())
              + (r.kind() == ReadingKind.AC
                  ? " AC "
                      + Words.measure(r.measureWord())
                      + " at "
                      + (r.hz() == null ? "?" : Words.hertz(r.hz()))
                  : "")
              + "   ("
              + Words.dateTime(r.takenAt())
              + ")"
              + (r.struck()
                  ? "   struck out " + Words.dateTime(r.struckAt()) + ", not counted"
                  : ""));
    }
    List<String> suspects = new ArrayList<>();
    if (!file.suspectLists().isEmpty()) {
      SuspectListRecord last = file.suspectLists().get(file.suspectLists().size() - 1);
      suspects.add(
          "As ranked " + Words.dateTime(last.computedAt()) + " (verdict: " + last.verdict() + "):");
      for (StoredSuspect s : last.suspects().stream().limit(6).toList()) {
        suspects.add(
            s.rank() + ". " + Words.fault(s.fault()) + "  " + Words.percent(s.probability()));
      }
    }
    List<String> actions = new ArrayList<>();
    for (RepairAction a : file.actions()) {
      actions.add(Words.actionLine(a));
    }
    List<String> notes = new ArrayList<>();
    for (CaseNote n : file.notes()) {
      notes.add(Words.dateTime(n.at()) + ":  " + n.text());
    }
    return new CaseView(
        rc.id(), title, rc.symptom(), status, faults, readings, suspects, actions, notes);
  }
}
