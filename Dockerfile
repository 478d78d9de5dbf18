# Runtime image for the service. Build the jar first: mvn -DskipTests package
FROM eclipse-temurin:17-jre
RUN useradd --system --uid 10001 kwanta
WORKDIR /app
COPY service/target/kwanta-service.jar /app/kwanta-service.jar
USER kwanta
EXPOSE 8080
ENTRYPOINT ["java", "-XX:MaxRAMPercentage=75", "-jar", "/app/kwanta-service.jar"]
