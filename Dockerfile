# Runtime image for the service. Build the jar first: mvn -DskipTests package
FROM eclipse-temurin:17-jre
# /run/kwanta-scrape-key: where docker-compose.yml mounts the volume shared with Prometheus; Docker gives an
# empty named volume this directory's owner, so the service can write the scrape key file there
RUN useradd --system --uid 10001 kwanta \
 && mkdir -p /run/kwanta-scrape-key && chown kwanta /run/kwanta-scrape-key
WORKDIR /app
COPY service/target/kwanta-service.jar /app/kwanta-service.jar
USER kwanta
EXPOSE 8080
ENTRYPOINT ["java", "-XX:MaxRAMPercentage=75", "-jar", "/app/kwanta-service.jar"]
