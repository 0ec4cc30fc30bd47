using System.Globalization;
using Briefwright.Model.Uncertainty;
using Briefwright.Scenario;
using System.Text;

namespace Briefwright.Brief.Formats;

/// <summary>How a column's cells are written and shown.</summary>
public enum ColumnKind
{
    Text,

    /// <summary>A whole number such as a calendar year or a count (format <c>0</c>).</summary>
    Whole,

    /// <summary>
    /// A number as the spreadsheet program shows it (all its digits); for columns whose values differ in size.
    /// </summary>
    General,

    /// <summary>A number shown with three decimals.</summary>
    Number,

    /// <summary>A share stored as a fraction and shown as a percent (<c>0.0%</c>): 0.041 shows as 4.1%.</summary>
    Percent,

    /// <summary>Yes or no, as text.</summary>
    YesNo,
}

/// <summary>A column of a sheet: its header (with the unit) and kind.</summary>
public sealed record SheetColumn(string Header, ColumnKind Kind, double Width = 14);

/// <summary>
/// One sheet of the workbook: a header row and rows of values (strings, numbers, booleans or null for an empty cell).
/// </summary>
public sealed record SheetTable(string Name, string Description, IReadOnlyList<SheetColumn> Columns,
    IReadOnlyList<IReadOnlyList<object?>> Rows);

/// <summary>
/// The spreadsheet annex: one workbook per brief, a first sheet saying what it is (scenario, edition, date, input hash,
/// the cautions) and a sheet per results table. Units are in the headers, shares are stored as fractions and shown as
/// percents, the header row is frozen, and every text is a typed text cell (never a formula; text a spreadsheet program
/// would read as one on editing carries the quote prefix). Same content, same bytes: the package's dates are the
/// brief's, and the zip entries are stamped with it.
/// </summary>
public sealed class WorkbookWriter : IBriefWriter
{
    public string Suffix => "xlsx";

    public byte[] Write(BriefContent content) =>
        Write(Tables(content), content.Solved.Scenario.Brief.Date, content.OrganisationName,
            content.Document.Info.Title, content.Theme.HeaderFill);

    /// <summary>The sheets of a brief's workbook, the "About" sheet first.</summary>
    public static IReadOnlyList<SheetTable> Tables(BriefContent content)
    {
        var solved = content.Solved;
        var scenario = solved.Scenario;
        var brief = scenario.Brief;
        var a = solved.Analysis;
        var labels = solved.BalancedGrowth.Options.ToDictionary(o => o.Id, o => o.Label, StringComparer.Ordinal);
        string Label(string id) => labels.GetValueOrDefault(id, id);
        var tables = new List<SheetTable>();
        var sheets = Sheets(a);
        var about = new List<IReadOnlyList<object?>>
        {
            Row("What this is", $"The spreadsheet annex of the brief \"{brief.Title}\": its results tables as " +
                "numbers, from the same run as the brief."),
            Row("Scenario", brief.Id),
            Row("Date", brief.Date.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture)),
            Row("Edition", $"{brief.Edition} ({brief.Status})"),
            Row("Organisation", content.OrganisationName),
            Row("Input hash (SHA-256)", scenario.InputHash),
            Row("Tool", $"briefwright {ToolInfo.Version}"),
            Row("Caution", "Results are model illustrations under stated assumptions, not forecasts; official " +
                "statistics and the commissioning body's own appraisal rules prevail."),
            Row("Units", "Each header names its unit. Shares are stored as fractions and shown as percents (a cell " +
                "showing 4.1% holds 0.041)."),
        };
        about.AddRange(sheets.Select(s => Row("Sheet: " + s.Item1, s.Item2)));
        tables.Add(new SheetTable("About", "What this workbook is.",
            [new("Item", ColumnKind.Text, 24), new("Value", ColumnKind.Text, 100)], about));

        tables.Add(new SheetTable("Assumptions", sheets[0].Item2,
            [new("Path", ColumnKind.Text, 34), new("Label", ColumnKind.Text, 34),
             new("Value (percent for rates)", ColumnKind.General, 14), new("Value as text", ColumnKind.Text, 18),
             new("Unit", ColumnKind.Text, 10), new("Source", ColumnKind.Text, 50), new("Note", ColumnKind.Text, 50)],
            scenario.Assumptions.Select(x => Row(x.Path, x.Label,
                x.Unit == ValueUnit.Rate && x.Value is { } v ? new PercentValue(v) : x.Value, x.Text,
                x.Unit.ToString().ToLowerInvariant(), x.Source, x.Note)).ToList()));

        tables.Add(new SheetTable("Options", sheets[1].Item2,
            [new("Option id", ColumnKind.Text, 20), new("Option", ColumnKind.Text, 34),
             new("Baseline", ColumnKind.YesNo, 10), new("Schooling (years)", ColumnKind.Number),
             new("Workers per person (fraction)", ColumnKind.Number, 16),
             new("Human capital per worker (index)", ColumnKind.Number, 16),
             new("Output per person (model units)", ColumnKind.Number, 16),
             new("Change vs baseline (%)", ColumnKind.Percent, 16)],
            solved.BalancedGrowth.Options.Select(o => Row(o.Id, o.Label, o.IsBaseline, o.SchoolingYears, o.WorkerShare,
                o.HumanCapitalPerWorker, o.OutputPerPerson, o.ChangeVsBaselinePct / 100)).ToList()));

        AddReformSheets(tables, a, sheets, Label);
        AddUncertaintySheets(tables, a, sheets, Label);
        return tables;
    }

    /// <summary>Each sheet after "About", by name, with the sentence that describes it.</summary>
    private static List<(string, string)> Sheets(AnalysisResults a)
    {
        var sheets = new List<(string, string)>
        {
            ("Assumptions", "Every assumption of the scenario with its unit and source."),
            ("Options", "Each option once the economy has adjusted (balanced growth path)."),
            ("Reform paths", "Output per person against no reform, year by year after the reform, per option."),
            ("Present values", "Discounted value of each option's gain, per discount schedule, in years of output " +
                "per person."),
        };
        if (a.Tornado.Count > 0)
            sheets.Add(("Sensitivity",
                "Each option's long-run change with one assumption at the low and high end of its range."));
        if (a.MonteCarlo is not null)
            sheets.Add(("Monte Carlo", "Percentiles over the Monte Carlo draws, with the probability of a gain."));
        if (a.Sobol is not null)
            sheets.Add(("Sobol", "Which assumption matters most: Sobol indices with their bootstrap intervals."));
        return sheets;
    }

    /// <summary>The reform paths, present values and (when the scenario asks for them) sensitivity sheets;
    /// <paramref name="Label"/> gives an option's label from its id.</summary>
    private static void AddReformSheets(List<SheetTable> tables, AnalysisResults a, List<(string, string)> sheets,
        Func<string, string> Label)
    {
        var reform = a.Reform;
        int years = reform.Options.Count == 0 ? 0 : reform.Options.Max(o => o.Path.Gain.Length);
        tables.Add(new SheetTable("Reform paths", sheets[2].Item2,
            new[] { new SheetColumn("Calendar year", ColumnKind.Whole, 12),
                    new SheetColumn("Years after reform", ColumnKind.Whole, 12) }
                .Concat(reform.Options.Select(o =>
                    new SheetColumn($"{Label(o.OptionId)}: change vs no reform (%)", ColumnKind.Percent, 22)))
                .ToList(),
            Enumerable.Range(0, years).Select(t => (IReadOnlyList<object?>)new object?[] { reform.ReformYear + t, t }
                .Concat(reform.Options.Select(o => t < o.Path.Gain.Length ? (object?)o.Path.Gain[t] : null))
                .ToList()).ToList()));

        tables.Add(new SheetTable("Present values", sheets[3].Item2,
            [new("Option id", ColumnKind.Text, 20), new("Option", ColumnKind.Text, 30),
             new("Discount schedule", ColumnKind.Text, 36), new("Valuation year", ColumnKind.Whole, 10),
             new("Discount factor to the reform year (fraction)", ColumnKind.Number, 16),
             new("To the horizon (years of output per person)", ColumnKind.Number, 18),
             new("Tail beyond the horizon (years of output per person)", ColumnKind.Number, 18),
             new("Total (years of output per person)", ColumnKind.Number, 18),
             new("Pays back (calendar year)", ColumnKind.Whole, 12)],
            reform.Options.SelectMany(o => o.PresentValues.Select(p => Row(o.OptionId, Label(o.OptionId),
                p.ScheduleLabel, p.ValuationYear, p.DiscountFactorToReform, p.ToHorizon, p.Tail, p.Total,
                p.BreakEvenCalendarYear))).ToList()));

        if (a.Tornado.Count > 0)
            tables.Add(new SheetTable("Sensitivity", sheets.First(s => s.Item1 == "Sensitivity").Item2,
                [new("Assumption", ColumnKind.Text, 30), new("Parameter", ColumnKind.Text, 22),
                 new("Low (percent for rates)", ColumnKind.General),
                 new("High (percent for rates)", ColumnKind.General), new("Option", ColumnKind.Text, 30),
                 new("Change at low (%)", ColumnKind.Percent), new("Change at high (%)", ColumnKind.Percent),
                 new("Optimum at low (years)", ColumnKind.Number), new("Optimum at high (years)", ColumnKind.Number)],
                a.Tornado.SelectMany(t => t.AtLow.OptionIds.Select((id, k) =>
                {
                    bool rate = Model.Uncertainty.Parameters.Find(t.Parameter)?.IsRate == true;
                    return Row(t.Label, t.Parameter, rate ? new PercentValue(t.Low) : t.Low,
                        rate ? new PercentValue(t.High) : t.High, Label(id), t.AtLow.LongRunChangePct[k] / 100,
                        t.AtHigh.LongRunChangePct[k] / 100, t.AtLow.OptimumYears, t.AtHigh.OptimumYears);
                })).ToList()));
    }

    /// <summary>The Monte Carlo and Sobol sheets, when the scenario asks for them; <paramref name="Label"/> gives an
    /// option's label from its id.</summary>
    private static void AddUncertaintySheets(List<SheetTable> tables, AnalysisResults a, List<(string, string)> sheets,
        Func<string, string> Label)
    {
        if (a.MonteCarlo is { } mc)
        {
            var rows = new List<IReadOnlyList<object?>>();
            foreach (var o in mc.Options)
            {
                rows.Add(McRow("Long-run change in output per person", "percent", Label(o.OptionId), o.LongRunChangePct,
                    0.01, o.ProbabilityGain));
                rows.Add(McRow("Present value to the horizon", "years of output per person", Label(o.OptionId),
                    o.PresentValue, 1, o.ProbabilityPositivePv));
            }
            rows.Add(McRow("Output-maximising schooling", "years", "", mc.OptimumYears, 1, null));
            tables.Add(new SheetTable("Monte Carlo", sheets.First(s => s.Item1 == "Monte Carlo").Item2,
                [new("Result", ColumnKind.Text, 34), new("Unit (percent cells hold fractions)", ColumnKind.Text, 24),
                 new("Option", ColumnKind.Text, 30), new("5th percentile", ColumnKind.Number),
                 new("25th percentile", ColumnKind.Number), new("Median", ColumnKind.Number),
                 new("75th percentile", ColumnKind.Number), new("95th percentile", ColumnKind.Number),
                 new("Mean", ColumnKind.Number), new("Probability positive (%)", ColumnKind.Percent),
                 new("Probability, 95% interval low (%)", ColumnKind.Percent),
                 new("Probability, 95% interval high (%)", ColumnKind.Percent), new("Draws", ColumnKind.Whole, 10)],
                rows));
        }

        if (a.Sobol is { } sobol)
            tables.Add(new SheetTable("Sobol", sheets.First(s => s.Item1 == "Sobol").Item2,
                [new("Output", ColumnKind.Text, 30), new("Parameter", ColumnKind.Text, 22),
                 new("First-order share (%)", ColumnKind.Percent), new("First-order low (%)", ColumnKind.Percent),
                 new("First-order high (%)", ColumnKind.Percent), new("Total share (%)", ColumnKind.Percent),
                 new("Total low (%)", ColumnKind.Percent), new("Total high (%)", ColumnKind.Percent),
                 new("Confidence level (%)", ColumnKind.Percent), new("Base samples", ColumnKind.Whole)],
                sobol.Outputs.SelectMany((output, k) => sobol.Indices[k].Inputs.Select((name, i) =>
                {
                    var x = sobol.Indices[k];
                    return Row(output, name, x.FirstOrder[i], x.FirstOrderLow[i], x.FirstOrderHigh[i], x.Total[i],
                        x.TotalLow[i], x.TotalHigh[i], x.Level, x.Samples);
                })).ToList()));
    }

    /// <summary>A value in a number column that is a rate: stored as a fraction, shown as a percent.</summary>
    public sealed record PercentValue(double Fraction);

    private static IReadOnlyList<object?> Row(params object?[] cells) => cells;

    private static IReadOnlyList<object?> McRow(string result, string unit, string option, PercentileSummary s,
        double scale, Probability? p)
    {
        object? V(double x) => scale == 1 ? x : new PercentValue(x * scale);
        return Row(result, unit, option, V(s.P5), V(s.P25), V(s.P50), V(s.P75), V(s.P95), V(s.Mean), p?.Estimate,
            p?.Low, p?.High, p?.Draws);
    }

    // Cell formats (indices into the stylesheet's cellXfs).
    private const uint General = 0, Header = 1, PercentFormat = 2, NumberFormat = 3, WholeFormat = 4,
        WrapText = 5, QuotedText = 6;

    public static byte[] Write(IReadOnlyList<SheetTable> tables, DateOnly date, string organisation, string title,
        Composer.Layout.Rgb headerFill)
    {
        const string Ns = "http://schemas.openxmlformats.org/officeDocument/2006/relationships/";
        var package = new OfficePackage(date);
        package.Relate("/", "rId1", Ns + "officeDocument", "/xl/workbook.xml");
        var sheets = new StringBuilder();
        for (int i = 0; i < tables.Count; i++)
        {
            string rid = $"rIdSheet{i + 1}";
            sheets.Append("<sheet name=\"").Append(OfficePackage.Escape(tables[i].Name))
                .Append("\" sheetId=\"").Append(i + 1).Append("\" r:id=\"").Append(rid).Append("\"/>");
        }
        package.AddXml("/xl/workbook.xml", "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet.main+xml",
            $"<workbook xmlns=\"{Main}\" xmlns:r=\"{OfficePackage.RelationshipsNs}\">" +
            $"<bookViews><workbookView/></bookViews><sheets>{sheets}</sheets></workbook>");
        package.Relate("/xl/workbook.xml", "rIdStyles", Ns + "styles", "/xl/styles.xml");
        package.AddXml("/xl/styles.xml", "application/vnd.openxmlformats-officedocument.spreadsheetml.styles+xml",
            Stylesheet($"FF{headerFill.R:X2}{headerFill.G:X2}{headerFill.B:X2}"));
        for (int i = 0; i < tables.Count; i++)
        {
            string name = $"/xl/worksheets/sheet{i + 1}.xml";
            package.Relate("/xl/workbook.xml", $"rIdSheet{i + 1}", Ns + "worksheet", name);
            package.AddXml(name, "application/vnd.openxmlformats-officedocument.spreadsheetml.worksheet+xml",
                Worksheet(tables[i]));
        }
        package.CoreProperties(title, organisation);
        return package.ToBytes();
    }

    private const string Main = "http://schemas.openxmlformats.org/spreadsheetml/2006/main";

    /// <summary>
    /// A sheet's XML (SpreadsheetML, ECMA-376 Part 1); the tests read it back and validate it with the Open XML SDK.
    /// </summary>
    private static string Worksheet(SheetTable table)
    {
        var sb = new StringBuilder(table.Rows.Count * table.Columns.Count * 48 + 1024);
        sb.Append("<worksheet xmlns=\"").Append(Main).Append("\"><sheetViews><sheetView")
            .Append(table.Name == "About" ? " tabSelected=\"1\"" : "")
            .Append(" workbookViewId=\"0\"><pane ySplit=\"1\" topLeftCell=\"A2\" activePane=\"bottomLeft\" " +
                "state=\"frozen\"/>")
            .Append("<selection pane=\"bottomLeft\" activeCell=\"A2\" sqref=\"A2\"/></sheetView></sheetViews>" +
                "<sheetFormatPr defaultRowHeight=\"15\"/><cols>");
        for (int c = 0; c < table.Columns.Count; c++)
            sb.Append("<col min=\"").Append(c + 1).Append("\" max=\"").Append(c + 1).Append("\" width=\"")
              .Append(table.Columns[c].Width.ToString("R", CultureInfo.InvariantCulture))
              .Append("\" customWidth=\"1\"/>");
        sb.Append("</cols><sheetData><row r=\"1\">");
        for (int c = 0; c < table.Columns.Count; c++) TextCell(sb, Ref(c, 1), table.Columns[c].Header, Header);
        sb.Append("</row>");
        for (int r = 0; r < table.Rows.Count; r++)
        {
            uint index = (uint)(r + 2);
            sb.Append("<row r=\"").Append(index).Append("\">");
            var cells = table.Rows[r];
            for (int c = 0; c < cells.Count && c < table.Columns.Count; c++)
                Cell(sb, Ref(c, index), cells[c], table.Columns[c].Kind, table.Name == "About");
            sb.Append("</row>");
        }
        sb.Append("</sheetData>");
        if (table.Rows.Count > 0)
            sb.Append("<autoFilter ref=\"A1:").Append(Ref(table.Columns.Count - 1, (uint)(table.Rows.Count + 1)))
                .Append("\"/>");
        return sb.Append("</worksheet>").ToString();
    }

    private static void Cell(StringBuilder sb, string reference, object? value, ColumnKind kind, bool wrap)
    {
        switch (value)
        {
            case null:
                break;
            case string s:
                TextCell(sb, reference, s, wrap ? WrapText : General);
                break;
            case bool b:
                TextCell(sb, reference, b ? "yes" : "no", General);
                break;
            case PercentValue p:
                NumberCell(sb, reference, p.Fraction, PercentFormat);
                break;
            case double d when !double.IsFinite(d):
                break;
            case double d:
                NumberCell(sb, reference, d, kind switch
                {
                    ColumnKind.Percent => PercentFormat, ColumnKind.Whole => WholeFormat, ColumnKind.General => General,
                    _ => NumberFormat,
                });
                break;
            case int i:
                NumberCell(sb, reference, i, kind == ColumnKind.Percent ? PercentFormat : WholeFormat);
                break;
            default:
                TextCell(sb, reference, Convert.ToString(value, CultureInfo.InvariantCulture) ?? "", General);
                break;
        }
    }

    private static void NumberCell(StringBuilder sb, string reference, double value, uint style) =>
        sb.Append("<c r=\"").Append(reference).Append("\"").Append(style == 0 ? "" : $" s=\"{style}\"").Append("><v>")
          .Append(value.ToString("R", CultureInfo.InvariantCulture)).Append("</v></c>");

    /// <summary>
    /// A typed text cell; text that starts like a formula gets the quote prefix, so editing the cell keeps it text.
    /// </summary>
    private static void TextCell(StringBuilder sb, string reference, string text, uint style)
    {
        bool formulaLike = text.Length > 0 && text[0] is '=' or '+' or '-' or '@' or '\t' or '\r';
        uint s = formulaLike && style == General ? QuotedText : style;
        bool preserve = text.Length > 0 && (char.IsWhiteSpace(text[0]) || char.IsWhiteSpace(text[^1]));
        sb.Append("<c r=\"").Append(reference).Append("\"").Append(s == 0 ? "" : $" s=\"{s}\"")
            .Append(" t=\"inlineStr\"><is><t").Append(preserve ? " xml:space=\"preserve\"" : "").Append('>')
            .Append(OfficePackage.Escape(text)).Append("</t></is></c>");
    }

    public static string Ref(int column, uint row)
    {
        string letters = "";
        for (int c = column + 1; c > 0; c = (c - 1) / 26) letters = (char)('A' + (c - 1) % 26) + letters;
        return letters + row.ToString(CultureInfo.InvariantCulture);
    }

    private static string Stylesheet(string headerArgb) =>
        $"<styleSheet xmlns=\"{Main}\">" +
        "<numFmts count=\"2\"><numFmt numFmtId=\"164\" formatCode=\"0.0%\"/><numFmt numFmtId=\"165\" " +
        "formatCode=\"0.000\"/></numFmts>" +
        "<fonts count=\"2\"><font><sz val=\"10\"/><name val=\"Liberation Sans\"/></font><font><b/><sz " +
        "val=\"10\"/><name val=\"Liberation Sans\"/></font></fonts>" +
        "<fills count=\"3\"><fill><patternFill patternType=\"none\"/></fill><fill><patternFill " +
        "patternType=\"gray125\"/></fill>" +
        $"<fill><patternFill patternType=\"solid\"><fgColor rgb=\"{headerArgb}\"/></patternFill></fill></fills>" +
        "<borders count=\"1\"><border><left/><right/><top/><bottom/><diagonal/></border></borders>" +
        "<cellStyleXfs count=\"1\"><xf numFmtId=\"0\" fontId=\"0\" fillId=\"0\" borderId=\"0\"/></cellStyleXfs>" +
        "<cellXfs count=\"7\">" +
        "<xf numFmtId=\"0\" fontId=\"0\" fillId=\"0\" borderId=\"0\" xfId=\"0\"/>" +
        "<xf numFmtId=\"0\" fontId=\"1\" fillId=\"2\" borderId=\"0\" xfId=\"0\" applyFont=\"1\" applyFill=\"1\" " +
        "applyAlignment=\"1\"><alignment vertical=\"top\" wrapText=\"1\"/></xf>" +
        "<xf numFmtId=\"164\" fontId=\"0\" fillId=\"0\" borderId=\"0\" xfId=\"0\" applyNumberFormat=\"1\"/>" +
        "<xf numFmtId=\"165\" fontId=\"0\" fillId=\"0\" borderId=\"0\" xfId=\"0\" applyNumberFormat=\"1\"/>" +
        "<xf numFmtId=\"1\" fontId=\"0\" fillId=\"0\" borderId=\"0\" xfId=\"0\" applyNumberFormat=\"1\"/>" +
        "<xf numFmtId=\"0\" fontId=\"0\" fillId=\"0\" borderId=\"0\" xfId=\"0\" applyAlignment=\"1\"><alignment " +
        "vertical=\"top\" wrapText=\"1\"/></xf>" +
        "<xf numFmtId=\"49\" fontId=\"0\" fillId=\"0\" borderId=\"0\" xfId=\"0\" quotePrefix=\"1\" " +
        "applyNumberFormat=\"1\"/>" +
        "</cellXfs><cellStyles count=\"1\"><cellStyle name=\"Normal\" xfId=\"0\" " +
        "builtinId=\"0\"/></cellStyles></styleSheet>";
}
