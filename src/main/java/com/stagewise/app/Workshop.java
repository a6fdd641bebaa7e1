package com.stagewise.app;

import com.stagewise.history.HistoryStore;
import com.stagewise.history.sqlite.SqliteHistory;
import com.stagewise.ui.BoardFlags;
import com.stagewise.ui.CaseResume;
import java.nio.file.Path;

/**
 * The shop's files, opened: the history, the settings, the board flags and the open cases' places.
 *
 * @param folder where the files are
 * @param store the history
 * @param settings the settings
 * @param boardFlags which board models are mains-powered
 * @param resume where open cases were left
 */
record Workshop(
    DataFolder folder,
    HistoryStore store,
    Settings settings,
    BoardFlags boardFlags,
    CaseResume resume)
    implements AutoCloseable {

  /**
   * Opens the shop's files; with {@code demo}, fills an empty database with the demo data and the
   * stage library from {@code stages}.
   */
  static Workshop open(DataFolder folder, boolean demo, Path stages) {
    HistoryStore store = SqliteHistory.open(folder.database());
    try {
      FileBoardFlags flags =
          new FileBoardFlags(
              folder
                  .database()
                  .toAbsolutePath()
                  .getParent()
                  .resolve(folder.database().getFileName() + ".flags.properties"));
      if (demo && store.isEmpty()) {
        DemoSetup.fill(store, flags, stages);
      }
      return new Workshop(
          folder,
          store,
          new Settings(folder.settings()),
          flags,
          new CaseResume(folder.openCases()));
    } catch (RuntimeException e) {
      store.close();
      throw e;
    }
  }

  @Override
  public void close() {
    store.close();
  }
}
