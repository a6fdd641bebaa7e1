package com.stagewise.bench;

import com.stagewise.circuit.DeviceClass;
import com.stagewise.circuit.PackageType;
import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.Terminal;
import com.stagewise.interchange.StageSheet;
import com.stagewise.ui.drawing.SchematicPicture;
import com.stagewise.ui.editor.StageEditorModel;
import java.nio.file.Path;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Threads;
import org.openjdk.jmh.annotations.Warmup;

/**
 * The stage editor after one edit: the edit, the re-check of the whole stage (stage rules, floating
 * nets, supplies), and the schematic laid out again and drawn (SVG text, the toolkit-free drawing
 * of the same layout). Target: under 50 ms. Stages: the five-section chain demo and the same chain
 * grown to eight sections (two full quad packages), the most the editor is made for.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.SampleTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 3, time = 2)
@Measurement(iterations = 5, time = 2)
@Fork(1)
@Threads(1)
public class EditorBenchmark {
  @Param({"5", "8"})
  public int sections;

  private StageEditorModel editor;
  private boolean flip;

  @Setup(Level.Trial)
  public void setUp() {
    editor = new StageEditorModel();
    editor.startFrom(
        StageSheet.read(Path.of("data/stages/tarnwell-ps4-channel-chain.stage.json")), "chain");
    String from = "DRV";
    for (int i = editor.draft().sections().size(); i < sections; i++) {
      String letter = editor.freeSections(PackageType.QUAD_14, "U2").get(0);
      String ref =
          editor
              .addSection(PackageType.QUAD_14, "U2", letter, DeviceClass.CLASSIC_BIPOLAR)
              .orElseThrow();
      String in = editor.addPart(PartKind.RESISTOR);
      String fb = editor.addPart(PartKind.RESISTOR);
      editor.setPartNet(in, 0, from);
      editor.setPartNet(in, 1, "S" + ref);
      editor.setPartNet(fb, 0, "S" + ref);
      editor.setPartNet(fb, 1, "O" + ref);
      editor.setSectionNet(ref, Terminal.IN_PLUS, "GND");
      editor.setSectionNet(ref, Terminal.IN_MINUS, "S" + ref);
      editor.setSectionNet(ref, Terminal.OUT, "O" + ref);
      from = "O" + ref;
    }
    if (editor.stage().isEmpty() || editor.draft().sections().size() != sections) {
      throw new IllegalStateException("benchmark stage is not sound: " + editor.problems());
    }
  }

  /** One value edit, the re-check it triggers, and the schematic drawn again. */
  @Benchmark
  public String editRecheckAndRedraw() {
    flip = !flip;
    editor.setPartValue("R4", flip ? "27k" : "22k");
    if (!editor.problems().isEmpty()) {
      throw new IllegalStateException(editor.problems().toString());
    }
    return SchematicPicture.svg(editor.drawable());
  }
}
