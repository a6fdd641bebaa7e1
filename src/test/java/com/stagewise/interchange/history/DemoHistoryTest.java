package com.stagewise.interchange.history;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import com.stagewise.circuit.Stage;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.ShopMemory;
import com.stagewise.history.demo.DemoHistory;
import com.stagewise.history.record.HistoryBundle;
import com.stagewise.history.record.StageSheetRecord;
import com.stagewise.history.sqlite.SqliteHistory;
import com.stagewise.interchange.StageSheet;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class DemoHistoryTest {
  @Test
  void demoStageSheets_areValidStageSheets() {
    HistoryBundle demo = DemoHistory.bundle();
    assertThat(demo.stageSheets()).hasSize(2);
    for (StageSheetRecord sheet : demo.stageSheets()) {
      Stage stage = StageSheet.read(sheet.sheetJson(), sheet.title());
      assertThat(stage.title()).isEqualTo(sheet.title());
    }
  }

  @Test
  void demo_fillsAnEmptyHistoryOnly_andFeedsTheShopMemory(@TempDir Path folder) {
    try (HistoryStore store = SqliteHistory.open(folder.resolve("demo.db"))) {
      assertThat(DemoHistory.fill(store).conflicts()).isEmpty();
      assertThat(new ShopMemory(store).faultCounts(DemoHistory.MIXER)).containsEntry("R2:open", 2);
      assertThatThrownBy(() -> DemoHistory.fill(store)).isInstanceOf(IllegalStateException.class);
      // The same demo from another bench merges without duplicates (ids come from fixed names).
      assertThat(store.transfer().importBundle(DemoHistory.bundle(), "demo").added()).isZero();
    }
  }
}
