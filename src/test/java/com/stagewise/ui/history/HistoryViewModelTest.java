package com.stagewise.ui.history;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.history.HistoryStore;
import com.stagewise.history.record.ActionKind;
import com.stagewise.history.record.Outcome;
import com.stagewise.history.record.ReadingKind;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.StoredSuspect;
import com.stagewise.history.record.SuspectListRecord;
import com.stagewise.ui.TestBench;
import java.nio.file.Path;
import java.time.Instant;
import java.util.List;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class HistoryViewModelTest {
  @TempDir Path temp;
  private TestBench t;
  private HistoryViewModel model;
  private String caseId;

  @BeforeEach
  void setUp() {
    t = TestBench.open(temp);
    var board = t.store.units().boardModel("Test amp board", "");
    var unit = t.store.units().add("TA-1", board.id(), "");
    var rc = t.store.cases().open(unit.id(), "Channel hums after a drop");
    caseId = rc.id();
    t.store
        .cases()
        .addReadings(
            caseId,
            List.of(
                new StoredReading(
                    HistoryStore.newId(),
                    caseId,
                    "U1.8",
                    ReadingKind.DC,
                    14.9,
                    null,
                    null,
                    "",
                    Instant.now())),
            new SuspectListRecord(
                HistoryStore.newId(),
                caseId,
                Instant.now(),
                "test",
                "fault",
                List.of(new StoredSuspect("U1.6-7:bridge", 0.7, List.of("U1.6-7:bridge"), "", 1)),
                ""));
    t.store
        .cases()
        .addAction(
            caseId, ActionKind.REFLOW, "U1", "", "", "Removed a bridge between pins 6 and 7");
    t.store.cases().addNote(caseId, "Solder splash under the op-amp.");
    t.store.cases().close(caseId, Outcome.FIXED, List.of("U1.6-7:bridge"));
    model = new HistoryViewModel(t.bench);
  }

  @AfterEach
  void tearDown() {
    t.close();
  }

  @Test
  void search_bySerial_findsTheCase() {
    model.fieldProperty().set(HistoryViewModel.Field.SERIAL);
    model.queryProperty().set("TA-1");
    model.search();
    assertThat(model.hits()).extracting(h -> h.caseId()).containsExactly(caseId);
  }

  @Test
  void search_byWords_findsTheCaseBySymptom() {
    model.queryProperty().set("hums");
    model.search();
    assertThat(model.hits()).extracting(h -> h.caseId()).containsExactly(caseId);
  }

  @Test
  void search_byPart_findsTheCaseByItsFault() {
    model.fieldProperty().set(HistoryViewModel.Field.PART);
    model.queryProperty().set("u1");
    model.search();
    assertThat(model.hits()).hasSize(1);
  }

  @Test
  void search_nothingMatches_saysSo() {
    model.fieldProperty().set(HistoryViewModel.Field.SERIAL);
    model.queryProperty().set("ZZ-404");
    model.search();
    assertThat(model.hits()).isEmpty();
    assertThat(model.hitsNoteProperty().get()).startsWith("No case matches");
  }

  @Test
  void show_closedCase_isShownAsItWas() {
    model.show(caseId);
    var view = model.shownProperty().get();
    assertThat(view.status()).contains("fixed");
    assertThat(view.faults()).isEqualTo("Solder bridge U1 pins 6–7");
    assertThat(view.readings())
        .singleElement()
        .asString()
        .startsWith("U1 pin 8:  14.90\u00a0V"); // the 60 V range shows two decimals
    assertThat(view.suspects()).hasSize(2);
    assertThat(view.suspects().get(1)).isEqualTo("1. Solder bridge U1 pins 6–7  70\u00a0%");
    assertThat(view.actions()).containsExactly("Reflow U1 — Removed a bridge between pins 6 and 7");
    assertThat(view.notes()).singleElement().asString().endsWith("Solder splash under the op-amp.");
    assertThat(model.timeline()).singleElement().asString().contains("Channel hums after a drop");
  }
}
