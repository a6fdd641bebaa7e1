package com.stagewise.ui.closeout;

import static com.stagewise.ui.closeout.AfterRepairCase.type;
import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.Reading;
import com.stagewise.history.record.CaseStatus;
import com.stagewise.history.record.Outcome;
import com.stagewise.history.record.StoredReading;
import com.stagewise.ui.TestBench;
import com.stagewise.ui.words.Words;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The check after the repair on the textbook inverting amplifier (gain −Rf/Rin = −47k/10k = −4.7
 * with 1 V in, so a healthy output reads −4.7 V; 1 % resistors keep the gain within about ±2 %): a
 * point read at −4.70 V is inside its healthy band, one stuck at the negative limit (−13.48 V, 1.5
 * V above the −15 V rail, DESIGN.md's classic-bipolar headroom) is outside, and closing as fixed
 * with it asks first. The readings after the repair are stored apart: the case's readings and its
 * diagnosis stay as they were.
 */
class AfterRepairViewModelTest {
  @TempDir Path temp;
  private TestBench t;
  private String caseId;

  @BeforeEach
  void setUp() {
    // The readings of the fault: the output at the negative limit, the rails, one AC reading.
    AfterRepairCase opened =
        AfterRepairCase.open(
            temp,
            "TA-9",
            "Output pinned low",
            List.of(
                dc("OUT", -13.48),
                dc("U1.8", 14.96),
                dc("OUT", -13.47),
                Reading.ac("OUT", 0.0, 1000)));
    t = opened.t;
    caseId = opened.caseId;
  }

  @AfterEach
  void tearDown() {
    t.close();
  }

  private static Reading dc(String at, double volts) {
    return Reading.dc(at, volts);
  }

  @Test
  void start_listsEachPointOnce_inTheOrderRead_withItsHealthyBand() {
    AfterRepairViewModel check = new AfterRepairViewModel(t.bench);
    check.start();

    // The AC reading of the fault is read again too, as its own point after the DC ones.
    assertThat(check.rows())
        .extracting(r -> r.point().kind() + " " + r.point().at())
        .containsExactly("DC OUT", "DC U1.8", "AC OUT");
    CheckRow out = check.rows().get(0);
    // Textbook: −4.7 V nominal; ±1 % on each resistor moves the gain by about ±2 %.
    assertThat(out.point().nominal()).isCloseTo(-4.7, org.assertj.core.data.Offset.offset(0.01));
    assertThat(out.point().low()).isBetween(-4.85, -4.75);
    assertThat(out.point().high()).isBetween(-4.65, -4.55);
    assertThat(check.currentProperty().get()).isZero();
  }

  @Test
  void readingsInsideAndOutside_areSaidPlainly_andClosingAsFixedAsksFirst() {
    CloseOutViewModel closeOut = new CloseOutViewModel(t.bench);
    closeOut.checkAfterRepair();
    AfterRepairViewModel check = closeOut.afterRepair();
    type(check, "-13.48");
    type(check, "14.96");

    assertThat(check.rows().get(0).verdict())
        .contains("OUTSIDE the healthy band, ")
        .endsWith(" below its bottom end");
    assertThat(check.rows().get(1).verdict()).contains("inside the healthy band");
    assertThat(check.summaryProperty().get())
        .startsWith("1 of 2 readings are inside the healthy band.")
        .contains(
            "Outside: "
                + Words.pin("OUT")
                + ": reads "
                + Words.measured(-13.48)
                + ", expected "
                + check.rows().get(0).bandWords());
    check.store(closeOut::endCheck);
    assertThat(closeOut.checkingProperty().get()).isFalse();

    closeOut.toggleFault("U1A:stuck-low", true);
    closeOut.outcomeProperty().set(Outcome.FIXED);
    closeOut.closeCase();
    // Not closed: asked first, naming the point outside its band.
    assertThat(closeOut.questionProperty().get())
        .contains(Words.pin("OUT") + ": reads", "Close the case as fixed anyway?");
    assertThat(t.store.cases().find(caseId).orElseThrow().status()).isEqualTo(CaseStatus.OPEN);
    closeOut.dontClose();
    assertThat(t.store.cases().find(caseId).orElseThrow().status()).isEqualTo(CaseStatus.OPEN);
    closeOut.closeCase();
    closeOut.closeAnyway();
    assertThat(t.store.cases().find(caseId).orElseThrow().status()).isEqualTo(CaseStatus.CLOSED);

    var file = t.store.cases().caseFile(caseId).orElseThrow();
    assertThat(file.afterRepair())
        .extracting(r -> r.at() + " " + r.value() + " " + r.inside())
        .containsExactly("OUT -13.48 false", "U1.8 14.96 true");
    // Kept apart: none of them is among the readings of the fault.
    assertThat(file.readings()).extracting(StoredReading::value).doesNotContain(14.96);
  }

  @Test
  void allInside_closesAsFixedWithoutAsking() {
    CloseOutViewModel closeOut = new CloseOutViewModel(t.bench);
    closeOut.checkAfterRepair();
    AfterRepairViewModel check = closeOut.afterRepair();
    type(check, "-4.70");
    type(check, "14.96");
    assertThat(check.summaryProperty().get())
        .startsWith("2 of 2 readings are inside the healthy band.");
    closeOut.toggleFault("U1A:stuck-low", true);
    closeOut.outcomeProperty().set(Outcome.FIXED);

    // The values read but not stored yet are stored as the case closes.
    closeOut.closeCase();

    assertThat(closeOut.questionProperty().get()).isEmpty();
    var file = t.store.cases().caseFile(caseId).orElseThrow();
    assertThat(file.repairCase().status()).isEqualTo(CaseStatus.CLOSED);
    assertThat(file.afterRepair()).hasSize(2).allMatch(r -> r.inside());
  }

  @Test
  void theDiagnosis_isUntouchedByTheCheck() {
    var before = t.bench.diagnosisProperty().get();
    var readingsBefore = List.copyOf(t.bench.readings());
    CloseOutViewModel closeOut = new CloseOutViewModel(t.bench);
    closeOut.checkAfterRepair();
    type(closeOut.afterRepair(), "-4.70");
    closeOut.afterRepair().store(() -> {});
    assertThat(t.bench.readings()).containsExactlyElementsOf(readingsBefore);
    assertThat(t.bench.diagnosisProperty().get()).isSameAs(before);
    assertThat(t.store.cases().caseFile(caseId).orElseThrow().readings()).isEmpty();
    assertThat(t.store.cases().caseFile(caseId).orElseThrow().afterRepair()).hasSize(1);
  }
}
