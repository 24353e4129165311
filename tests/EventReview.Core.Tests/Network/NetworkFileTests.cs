using EventReview.Core.Network;

namespace EventReview.Core.Tests.Network;

public class NetworkFileTests
{
    private const string Json = """
        {"name": "Demo net", "sites": [
          {"code": "KX", "name": "Site KX", "latitudeDegrees": 46, "longitudeDegrees": -119, "heightMeters": 100,
           "xArmAzimuthDegrees": 36, "yArmAzimuthDegrees": 126, "timingUncertaintySeconds": 0.0001},
          {"code": "M2", "name": "Site M2", "latitudeDegrees": 30, "longitudeDegrees": -90, "heightMeters": 0,
           "xArmAzimuthDegrees": 252, "yArmAzimuthDegrees": 342, "timingUncertaintySeconds": 0.0001}]}
        """;

    [Fact]
    public void A_network_file_reads_and_writes_back_the_same_sites()
    {
        var network = NetworkFile.Parse(Json);
        var again = NetworkFile.Parse(NetworkFile.Write(network));

        Assert.Equal("Demo net", again.Name);
        Assert.Equal(["KX", "M2"], again.Sites.Select(s => s.Code));
        Assert.Equal(252, again.Sites[1].XArmAzimuthDegrees);
        Assert.Contains("\"timingUncertaintySeconds\"", NetworkFile.Write(network));
    }

    [Fact]
    public void An_invalid_latitude_is_reported_with_the_site_index_and_field()
    {
        var ex = Assert.Throws<FormatException>(() => NetworkFile.Parse(Json.Replace("\"latitudeDegrees\": 30", "\"latitudeDegrees\": 95")));
        Assert.StartsWith("sites[1].latitudeDegrees:", ex.Message);
    }

    [Fact]
    public void A_missing_field_and_a_repeated_code_are_named()
    {
        var missing = Assert.Throws<FormatException>(() => NetworkFile.Parse(Json.Replace("\"heightMeters\": 100,", string.Empty)));
        Assert.Equal("sites[0].heightMeters: missing.", missing.Message);
        var repeated = Assert.Throws<FormatException>(() => NetworkFile.Parse(Json.Replace("\"M2\"", "\"KX\"")));
        Assert.StartsWith("sites[1].code:", repeated.Message);
    }

    [Fact]
    public void Malformed_json_is_a_format_error()
    {
        Assert.Throws<FormatException>(() => NetworkFile.Parse("{\"name\": \"x\", \"sites\": [}"));
    }
}
