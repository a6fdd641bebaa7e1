package com.stagewise.history.postgres;

import com.stagewise.history.AfterRepairContract;
import com.stagewise.history.CasesContract;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.PhotosContract;
import com.stagewise.history.SearchContract;
import com.stagewise.history.StageLibraryContract;
import com.stagewise.history.StageVersionsContract;
import com.stagewise.history.TransferContract;
import com.stagewise.history.UnitsContract;
import java.time.Clock;
import org.junit.jupiter.api.Nested;

/**
 * The PostgreSQL store passes every store contract, on a real server (a throwaway cluster, {@link
 * TestServer}), each test in a fresh shop schema.
 */
class PgContractTest {
  private static HistoryStore fresh(Clock clock) {
    TestServer server = TestServer.get();
    return PgHistory.open(server.freshShop(), clock, server.adminEnvironment());
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
