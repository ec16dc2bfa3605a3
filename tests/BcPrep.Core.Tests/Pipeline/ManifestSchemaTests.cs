using System.Text.Json;
using System.Text.Json.Nodes;
using BcPrep.Pipeline;
using BcPrep.Reading;
using BcPrep.Rig;
using BcPrep.Writing;
using Json.Schema;

namespace BcPrep.Tests.Pipeline;

/// <summary>The manifest written for real days validates against schemas/manifest.schema.json (draft 2020-12).</summary>
public class ManifestSchemaTests
{
    private static readonly Lazy<JsonSchema> Schema = new(() =>
        JsonSchema.FromText(File.ReadAllText(Path.Combine(RepoRoot.Path, "schemas", "manifest.schema.json"))));

    private static readonly Lazy<string> SampleManifest = new(() =>
    {
        var folder = Path.Combine(RepoRoot.Path, "sample-logs");
        var rig = RigLoader.Load(File.ReadAllText(Path.Combine(folder, "marten-rig.toml")), "sample-logs/marten-rig.toml");
        var logs = Directory.GetFiles(folder, "*.csv").Order(StringComparer.Ordinal).Select(LogInput.FromPath).ToList();
        var day = DayProcessor.Process(rig, logs, new ProcessOptions());
        return Manifest(day);
    });

    private static string Manifest(DayResult day) =>
        ManifestWriter.Write(day, new RunProvenance("test", new InputFingerprint("rig.toml", 1, new string('0', 64)), []), ["summary.csv"]);

    private static EvaluationResults Validate(string json)
    {
        using var document = JsonDocument.Parse(json);
        return Schema.Value.Evaluate(document.RootElement, new EvaluationOptions { OutputFormat = OutputFormat.List });
    }

    private static string Errors(EvaluationResults results) =>
        string.Join("\n", (results.Details ?? []).Where(d => d.Errors is not null).SelectMany(d => d.Errors!.Select(e => $"{d.InstanceLocation}: {e.Value}")));

    [Fact]
    public void Sample_day_manifest_is_valid()
    {
        var results = Validate(SampleManifest.Value);
        Assert.True(results.IsValid, Errors(results));
    }

    [Fact]
    public void Orifice_day_manifest_with_a_flow_meter_and_rake_is_valid()
    {
        using var day = BoundaryPhysicsTests.OrificeDay()
            .Channel("t_r10", SyntheticDay.Direct("bulk_temperature", "K", "plane = \"inlet\"\nradius = \"10 mm\""), 294.5, 0.01);
        var manifest = Manifest(day.Process());
        var results = Validate(manifest);
        Assert.True(results.IsValid, Errors(results));
        var boundary = JsonNode.Parse(manifest)!["points"]![0]!["boundary"]!;
        Assert.Equal("orifice", (string?)boundary["flow_meter"]!["kind"]);
        Assert.Equal("rake", (string?)boundary["inlet_temperature_profile"]!["source"]);
    }

    [Fact]
    public void Unknown_point_fields_are_allowed_but_a_wrong_verdict_is_not()
    {
        var root = JsonNode.Parse(SampleManifest.Value)!;
        root["points"]![0]!["detection_evidence"] = new JsonObject { ["note"] = "added by another stage" };
        Assert.True(Validate(root.ToJsonString()).IsValid);

        root["points"]![0]!["checks"]![0]!["verdict"] = "maybe";
        Assert.False(Validate(root.ToJsonString()).IsValid);
    }

    [Fact]
    public void A_missing_required_field_is_invalid()
    {
        var root = JsonNode.Parse(SampleManifest.Value)!;
        root["points"]![0]!["boundary"]!.AsObject().Remove("inlet_velocity_profile");
        Assert.False(Validate(root.ToJsonString()).IsValid);
    }
}
