package com.stagewise.ui;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.DeviceClass;
import com.stagewise.circuit.PackageType;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.Rail;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.TestInput;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.sqlite.SqliteHistory;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * A bench for view-model tests: a real history file in a temporary folder, work run at once on the
 * test's thread, and problems and cautions recorded instead of shown.
 */
public final class TestBench implements AutoCloseable {
  public final HistoryStore store;
  public final List<String> problems = new ArrayList<>();

  /** Each problem shown, as its title, what happened and what to do, one line each. */
  public final List<String> problemTexts = new ArrayList<>();

  public final List<SafetyCaution.Reason> cautions = new ArrayList<>();
  public final Map<String, Boolean> mains = new HashMap<>();
  public final CaseResume resume;
  public final Bench bench;

  private TestBench(Path folder) {
    store = SqliteHistory.open(folder.resolve("history.db"));
    resume = new CaseResume(folder.resolve("open-cases"));
    Problems recorder =
        (title, what, todo) -> {
          problems.add(title);
          problemTexts.add(title + "\n" + what + "\n" + todo);
        };
    Caution caution =
        (reason, then) -> {
          cautions.add(reason);
          then.run();
        };
    BoardFlags flags =
        new BoardFlags() {
          @Override
          public boolean isMainsPowered(String boardModelId) {
            return mains.getOrDefault(boardModelId, false);
          }

          @Override
          public void setMainsPowered(String boardModelId, boolean value) {
            mains.put(boardModelId, value);
          }
        };
    bench = new Bench(store, Tasks.direct(), recorder, caution, flags, resume);
  }

  /** Opens a bench on a new history in {@code folder}. */
  public static TestBench open(Path folder) {
    return new TestBench(folder);
  }

  @Override
  public void close() {
    store.close();
  }

  /**
   * An inverting amplifier, gain −Rf/Rin = −4.7, on ±15 V rails with 1 V at its input and a
   * classic-bipolar dual op-amp (section A of U1): the textbook stage the screens are tested on.
   */
  public static Stage invertingStage(String board) {
    return new Stage(
        "Inverting amplifier, test",
        board,
        "GND",
        List.of(new Rail("VCC", 15, 0.05), new Rail("VEE", -15, 0.05)),
        List.of(new TestInput("IN", 1.0, 0.1, 1000)),
        List.of(
            Part.resistor("R1", 10_000, 0.01, "IN", "SUM"),
            Part.resistor("R2", 47_000, 0.01, "SUM", "OUT")),
        List.of(
            new Amplifier(
                "U1A",
                "U1",
                PackageType.DUAL_8,
                "A",
                DeviceClass.CLASSIC_BIPOLAR,
                "GND",
                "SUM",
                "OUT",
                "VCC",
                "VEE")));
  }
}
