package com.stagewise.history.sqlite;

import com.stagewise.history.BundleCheck;
import com.stagewise.history.ImportReport;
import com.stagewise.history.SyncLedger;
import com.stagewise.history.jdbc.Importer;
import com.stagewise.history.jdbc.Records;
import com.stagewise.history.jdbc.Rows;
import com.stagewise.history.jdbc.SqlDialect;
import com.stagewise.history.record.AfterRepairReading;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.CaseNote;
import com.stagewise.history.record.HistoryBundle;
import com.stagewise.history.record.RepairAction;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StageSheetRecord;
import com.stagewise.history.record.StoredPhoto;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.SuspectListRecord;
import com.stagewise.history.record.Unit;
import java.sql.SQLException;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/** The bench file's side of sync: the outbox, the sync state and the shop-wide counts' cache. */
final class Ledger implements SyncLedger {
  /** Where a pending record of each kind belongs: the query of its group's key. */
  private static final Map<String, String> GROUP_OF =
      Map.of(
          BundleCheck.BOARD_MODEL, "SELECT id FROM board_model WHERE id = ?",
          BundleCheck.STAGE_SHEET, "SELECT board_model_id FROM stage_sheet WHERE id = ?",
          BundleCheck.UNIT, "SELECT id FROM unit WHERE id = ?",
          BundleCheck.CASE, "SELECT id FROM repair_case WHERE id = ?",
          BundleCheck.READING, "SELECT case_id FROM reading WHERE id = ?",
          BundleCheck.SUSPECT_LIST, "SELECT case_id FROM suspect_list WHERE id = ?",
          BundleCheck.ACTION, "SELECT case_id FROM repair_action WHERE id = ?",
          BundleCheck.NOTE, "SELECT case_id FROM case_note WHERE id = ?",
          BundleCheck.PHOTO, "SELECT case_id FROM case_photo WHERE id = ?",
          BundleCheck.AFTER_REPAIR, "SELECT case_id FROM after_repair_reading WHERE id = ?");

  private final SqliteHistory history;

  Ledger(SqliteHistory history) {
    this.history = history;
  }

  @Override
  public int pendingCount() {
    return history.read(
        "count pending records", c -> history.database().queryInt("SELECT count(*) FROM outbox"));
  }

  @Override
  public List<Batch> pendingBatches(int max, String programVersion) {
    Instant now = history.clock().instant();
    return history.read(
        "read pending records",
        c -> {
          try (Rows rows = new Rows(c, SqlDialect.SQLITE)) {
            // Board models first, then units, then cases: a batch's parents are in it anyway, but
            // this order sends a shop's new models before the cases that use them.
            List<Pending> all =
                rows.query(
                    "SELECT kind, id, version FROM outbox ORDER BY CASE kind WHEN 'board model'"
                        + " THEN 0 WHEN 'stage sheet' THEN 0 WHEN 'unit' THEN 1 ELSE 2 END,"
                        + " id",
                    rs -> new Pending(rs.getString(1), rs.getString(2), rs.getLong(3)));
            Map<String, List<Pending>> groups = new LinkedHashMap<>();
            Map<String, String> groupKind = new LinkedHashMap<>();
            for (Pending p : all) {
              String sql = GROUP_OF.get(p.kind());
              Optional<String> key =
                  sql == null ? Optional.empty() : rows.first(sql, rs -> rs.getString(1), p.id());
              if (key.isEmpty()) {
                continue;
              }
              String kind =
                  switch (p.kind()) {
                    case BundleCheck.BOARD_MODEL, BundleCheck.STAGE_SHEET ->
                        BundleCheck.BOARD_MODEL;
                    case BundleCheck.UNIT -> BundleCheck.UNIT;
                    default -> BundleCheck.CASE;
                  };
              String group = kind + " " + key.get();
              if (!groups.containsKey(group) && groups.size() >= max) {
                continue;
              }
              groups.computeIfAbsent(group, g -> new ArrayList<>()).add(p);
              groupKind.put(group, key.get());
            }
            List<Batch> batches = new ArrayList<>();
            for (Map.Entry<String, List<Pending>> group : groups.entrySet()) {
              String key = groupKind.get(group.getKey());
              batches.add(
                  new Batch(
                      bundle(rows, group.getKey(), key, group.getValue(), programVersion, now),
                      group.getValue()));
            }
            return batches;
          }
        });
  }

  private static HistoryBundle bundle(
      Rows rows,
      String group,
      String key,
      List<Pending> pending,
      String programVersion,
      Instant now)
      throws SQLException {
    Set<String> ids = new HashSet<>();
    for (Pending p : pending) {
      ids.add(p.id());
    }
    List<BoardModel> models = new ArrayList<>();
    List<StageSheetRecord> sheets = new ArrayList<>();
    List<Unit> units = new ArrayList<>();
    List<RepairCase> cases = new ArrayList<>();
    List<StoredReading> readings = new ArrayList<>();
    List<SuspectListRecord> lists = new ArrayList<>();
    List<RepairAction> actions = new ArrayList<>();
    List<CaseNote> notes = new ArrayList<>();
    List<StoredPhoto> photos = new ArrayList<>();
    List<AfterRepairReading> afterRepair = new ArrayList<>();
    if (group.startsWith(BundleCheck.BOARD_MODEL + " ")) {
      models.addAll(rows.query(Records.BOARD_MODEL + " WHERE id = ?", Records::boardModel, key));
      for (StageSheetRecord s :
          rows.query(
              Records.STAGE_SHEET + " WHERE board_model_id = ? ORDER BY updated_at, id",
              Records::stageSheet,
              key)) {
        if (ids.contains(s.id())) {
          sheets.add(s);
        }
      }
    } else if (group.startsWith(BundleCheck.UNIT + " ")) {
      Unit unit = rows.first(Records.UNIT + " WHERE id = ?", Records::unit, key).orElseThrow();
      models.addAll(
          rows.query(
              Records.BOARD_MODEL + " WHERE id = ?", Records::boardModel, unit.boardModelId()));
      units.add(unit);
    } else {
      RepairCase rc =
          rows.first(Records.cases(SqlDialect.SQLITE) + " WHERE c.id = ?", Records::repairCase, key)
              .orElseThrow();
      Unit unit =
          rows.first(Records.UNIT + " WHERE id = ?", Records::unit, rc.unitId()).orElseThrow();
      models.addAll(
          rows.query(
              Records.BOARD_MODEL + " WHERE id = ?", Records::boardModel, unit.boardModelId()));
      units.add(unit);
      if (rc.stageSheetId() != null) {
        // The version the case is diagnosed with goes along: the server may not have it yet.
        sheets.addAll(
            rows.query(
                Records.STAGE_SHEET + " WHERE id = ?", Records::stageSheet, rc.stageSheetId()));
      }
      cases.add(rc);
      for (StoredReading r :
          rows.query(
              Records.READING + " WHERE case_id = ? ORDER BY taken_at, rowid",
              Records::reading,
              key)) {
        if (ids.contains(r.id())) {
          readings.add(r);
        }
      }
      for (SuspectListRecord l :
          rows.suspectLists("WHERE case_id = ? ORDER BY computed_at, rowid", key)) {
        if (ids.contains(l.id())) {
          lists.add(l);
        }
      }
      for (RepairAction a :
          rows.query(
              Records.ACTION + " WHERE case_id = ? ORDER BY at, rowid", Records::action, key)) {
        if (ids.contains(a.id())) {
          actions.add(a);
        }
      }
      for (CaseNote n :
          rows.query(Records.NOTE + " WHERE case_id = ? ORDER BY at, row", Records::note, key)) {
        if (ids.contains(n.id())) {
          notes.add(n);
        }
      }
      for (AfterRepairReading r :
          rows.query(
              Records.AFTER_REPAIR + " WHERE case_id = ? ORDER BY taken_at, row",
              Records::afterRepair,
              key)) {
        if (ids.contains(r.id())) {
          afterRepair.add(r);
        }
      }
      for (String photoId :
          rows.query(
              "SELECT id FROM case_photo WHERE case_id = ? ORDER BY attached_at, row",
              rs -> rs.getString(1),
              key)) {
        if (ids.contains(photoId)) {
          photos.add(
              rows.first(
                      Records.PHOTO_WITH_IMAGE + " WHERE id = ?", Records::photoWithImage, photoId)
                  .orElseThrow());
        }
      }
    }
    return new HistoryBundle(
        HistoryBundle.CURRENT_VERSION,
        now,
        programVersion,
        models,
        sheets,
        units,
        cases,
        readings,
        lists,
        actions,
        notes,
        photos,
        afterRepair);
  }

  @Override
  public void uploaded(Batch batch) {
    history.write(
        "mark records as on the server",
        c -> {
          try (Rows rows = new Rows(c, SqlDialect.SQLITE)) {
            for (Pending p : batch.pending()) {
              rows.update(
                  "DELETE FROM outbox WHERE kind = ? AND id = ? AND version = ?",
                  p.kind(),
                  p.id(),
                  p.version());
            }
            return null;
          }
        });
  }

  @Override
  public ImportReport mergeFromServer(HistoryBundle bundle, String source) {
    Instant now = history.clock().instant();
    return history.write(
        "merge records from the server",
        c -> {
          ImportReport report = new Importer(c, SqlDialect.SQLITE, source, now).run(bundle);
          Set<String> kept = new HashSet<>();
          for (ImportReport.Conflict conflict : report.conflicts()) {
            kept.add(conflict.id());
          }
          try (Rows rows = new Rows(c, SqlDialect.SQLITE)) {
            for (String id : ids(bundle)) {
              if (!kept.contains(id)) {
                rows.update("DELETE FROM outbox WHERE id = ?", id);
              }
            }
          }
          return report;
        });
  }

  private static List<String> ids(HistoryBundle b) {
    List<String> ids = new ArrayList<>();
    b.boardModels().forEach(r -> ids.add(r.id()));
    b.stageSheets().forEach(r -> ids.add(r.id()));
    b.units().forEach(r -> ids.add(r.id()));
    b.cases().forEach(r -> ids.add(r.id()));
    b.readings().forEach(r -> ids.add(r.id()));
    b.suspectLists().forEach(r -> ids.add(r.id()));
    b.actions().forEach(r -> ids.add(r.id()));
    b.notes().forEach(r -> ids.add(r.id()));
    b.photos().forEach(r -> ids.add(r.photo().id()));
    b.afterRepair().forEach(r -> ids.add(r.id()));
    return ids;
  }

  @Override
  public long pulledThrough(String server) {
    return history.read(
        "read the sync state",
        c -> {
          try (Rows rows = new Rows(c, SqlDialect.SQLITE)) {
            return rows.first(
                    "SELECT pulled_through FROM sync_state WHERE server = ?",
                    rs -> rs.getLong(1),
                    server)
                .orElse(0L);
          }
        });
  }

  @Override
  public void pulled(String server, long through) {
    history.write(
        "record the sync state",
        c -> {
          try (Rows rows = new Rows(c, SqlDialect.SQLITE)) {
            rows.update(
                "INSERT INTO sync_state (server, pulled_through) VALUES (?, ?)"
                    + " ON CONFLICT (server) DO UPDATE SET pulled_through ="
                    + " max(pulled_through, excluded.pulled_through)",
                server,
                through);
            return null;
          }
        });
  }

  @Override
  public void synced(String server, Instant at) {
    history.write(
        "record the sync time",
        c -> {
          try (Rows rows = new Rows(c, SqlDialect.SQLITE)) {
            rows.update(
                "INSERT INTO sync_state (server, pulled_through, synced_at) VALUES (?, 0, ?)"
                    + " ON CONFLICT (server) DO UPDATE SET synced_at = excluded.synced_at",
                server,
                at);
            return null;
          }
        });
  }

  @Override
  public Optional<Instant> lastSync(String server) {
    return history.read(
        "read the sync state",
        c -> {
          try (Rows rows = new Rows(c, SqlDialect.SQLITE)) {
            return server == null
                ? rows.first(
                        "SELECT max(synced_at) FROM sync_state WHERE synced_at IS NOT NULL",
                        rs -> Records.time(rs, 1))
                    .map(Optional::ofNullable)
                    .orElse(Optional.empty())
                : rows.first(
                    "SELECT synced_at FROM sync_state WHERE server = ? AND synced_at IS NOT"
                        + " NULL",
                    rs -> Records.time(rs, 1),
                    server);
          }
        });
  }

  @Override
  public void cacheShopCounts(Map<String, Map<String, Integer>> counts) {
    history.write(
        "keep the shop's counts",
        c -> {
          try (Rows rows = new Rows(c, SqlDialect.SQLITE)) {
            rows.update("DELETE FROM shop_fault_count");
            for (Map.Entry<String, Map<String, Integer>> model : counts.entrySet()) {
              for (Map.Entry<String, Integer> fault : model.getValue().entrySet()) {
                rows.update(
                    "INSERT OR REPLACE INTO shop_fault_count (board_model, fault_id, count)"
                        + " VALUES (?, ?, ?)",
                    model.getKey(),
                    fault.getKey(),
                    fault.getValue());
              }
            }
            return null;
          }
        });
  }

  @Override
  public Map<String, Integer> shopCounts(String boardModelName) {
    return history.read(
        "read the shop's counts",
        c -> {
          try (Rows rows = new Rows(c, SqlDialect.SQLITE)) {
            Map<String, Integer> counts = new LinkedHashMap<>();
            for (Object[] row :
                rows.query(
                    "SELECT fault_id, count FROM shop_fault_count WHERE board_model = ?"
                        + " ORDER BY count DESC, fault_id",
                    rs -> new Object[] {rs.getString(1), rs.getInt(2)},
                    boardModelName.strip())) {
              counts.put((String) row[0], (Integer) row[1]);
            }
            return counts;
          }
        });
  }
}
