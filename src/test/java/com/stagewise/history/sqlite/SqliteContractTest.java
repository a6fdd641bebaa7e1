package com.stagewise.history.sqlite;

import com.stagewise.history.AfterRepairContract;
import com.stagewise.history.CasesContract;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.PhotosContract;
import com.stagewise.history.SearchContract;
import com.stagewise.history.StageLibraryContract;
import com.stagewise.history.StageVersionsContract;
import com.stagewise.history.TransferContract;
import com.stagewise.history.UnitsContract;
import java.nio.file.Path;
import java.time.Clock;
import java.util.concurrent.atomic.AtomicInteger;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.io.TempDir;

/** The embedded SQLite store passes every store contract. */
class SqliteContractTest {
  @TempDir Path folder;
  private final AtomicInteger files = new AtomicInteger();

  private HistoryStore fresh(Clock clock) {
    return SqliteHistory.open(folder.resolve("h" + files.incrementAndGet() + ".db"), clock);
  }

  @Nested
  class Units extends UnitsContract {
    @Override
    protected HistoryStore openStore(Clock clock) {
      return fresh(clock);
    }
  }

  @Nested
  class Cases extends CasesContract {
    @Override
    protected HistoryStore openStore(Clock clock) {
      return fresh(clock);
    }
  }

  @Nested
  class Search extends SearchContract {
    @Override
    protected HistoryStore openStore(Clock clock) {
      return fresh(clock);
    }
  }

  @Nested
  class Library extends StageLibraryContract {
    @Override
    protected HistoryStore openStore(Clock clock) {
      return fresh(clock);
    }
  }

  @Nested
  class Versions extends StageVersionsContract {
    @Override
    protected HistoryStore openStore(Clock clock) {
      return fresh(clock);
    }
  }

  @Nested
  class Transfers extends TransferContract {
    @Override
    protected HistoryStore openStore(Clock clock) {
      return fresh(clock);
    }
  }

  @Nested
  class Photos extends PhotosContract {
    @Override
    protected HistoryStore openStore(Clock clock) {
      return fresh(clock);
    }
  }

  @Nested
  class AfterRepair extends AfterRepairContract {
    @Override
    protected HistoryStore openStore(Clock clock) {
      return fresh(clock);
    }
  }
}
