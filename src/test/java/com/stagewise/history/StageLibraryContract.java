package com.stagewise.history;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.StageSheetRecord;
import java.util.List;
import org.junit.jupiter.api.Test;

/** The contract of {@link StageLibrary}: what every store does with stage sheets. */
public abstract class StageLibraryContract extends StoreContract {
  private static final String SHEET = "{\"format\": \"stagewise-stage\", \"version\": 1}";

  @Test
  void add_keepsTheTextExactlyInOrder() {
    BoardModel model = store.units().boardModel("MX-8", "");
    StageSheetRecord first = store.library().add(model.id(), "Input buffer", SHEET);
    clock.advanceMillis(1);
    StageSheetRecord second = store.library().add(model.id(), "Output", SHEET + "  ");
    assertThat(store.library().sheets(model.id())).containsExactly(first, second);
    assertThat(store.library().sheets(HistoryStore.newId())).isEmpty();
  }

  @Test
  void add_toAnUnknownBoardModel_isRefused() {
    assertThatThrownBy(() -> store.library().add(HistoryStore.newId(), "x", SHEET))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("board model");
  }

  @Test
  void addBoardModel_withSheets_addsAllAtOnce() {
    BoardModel model =
        store
            .library()
            .addBoardModel(
                "MX-8",
                "Northfield",
                List.of(
                    new StageLibrary.SheetDraft("A", SHEET),
                    new StageLibrary.SheetDraft("B", SHEET)));
    assertThat(store.units().boardModels()).containsExactly(model);
    assertThat(store.library().sheets(model.id()))
        .extracting(StageSheetRecord::title)
        .containsExactlyInAnyOrder("A", "B");
  }

  @Test
  void addBoardModel_oneSheetRefused_writesNeitherModelNorSheets() {
    String tooLong = "x".repeat(Checks.MAX_SHEET + 1);
    assertThatThrownBy(
            () ->
                store
                    .library()
                    .addBoardModel(
                        "MX-8",
                        "",
                        List.of(
                            new StageLibrary.SheetDraft("A", SHEET),
                            new StageLibrary.SheetDraft("B", tooLong))))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("sheets[1]");
    assertThat(store.units().boardModels()).isEmpty();
  }
}
